// The server-side data access for studio pages: signs the person in or sends
// them to /signin, checks their role through the one guard, and returns small DTOs.
import 'server-only';
import { notFound, redirect } from 'next/navigation';
import { getDb } from '@/db/client';
import { findGag, listGags } from '@/db/queries/gags';
import { findSeries, listSeriesForUser } from '@/db/queries/series';
import { authorizeSeries } from '@/lib/auth/guard';
import { type SessionUser, currentUser } from '@/lib/auth/session';

export async function requireUser(returnTo: string): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect(`/signin?callbackUrl=${encodeURIComponent(returnTo)}`);
  return user;
}

export async function loadSeriesIndex() {
  const user = await requireUser('/series');
  return { user, series: await listSeriesForUser(await getDb(), user.id) };
}

async function seriesAccess(seriesId: string, returnTo: string) {
  const user = await requireUser(returnTo);
  const access = await authorizeSeries(user.id, seriesId, 'read');
  if (!access.ok) notFound();
  const series = await findSeries(await getDb(), seriesId);
  if (!series) notFound();
  return { user, role: access.role, series };
}

export async function loadBoard(seriesId: string) {
  const base = await seriesAccess(seriesId, `/series/${seriesId}`);
  return { ...base, gags: await listGags(await getDb(), seriesId) };
}

export async function loadGag(seriesId: string, gagId: string) {
  const base = await seriesAccess(seriesId, `/series/${seriesId}/gags/${gagId}`);
  const gag = await findGag(await getDb(), gagId);
  if (!gag || gag.seriesId !== seriesId) notFound();
  return { ...base, gag };
}
