// The server-side data access for studio pages: signs the person in or sends
// them to /signin, checks their role through the one guard, and returns small DTOs.
import 'server-only';
import { notFound, redirect } from 'next/navigation';
import { getDb } from '@/db/client';
import { findGag, listGags } from '@/db/queries/gags';
import { findPassByNumber, listPasses } from '@/db/queries/passes';
import { findSeries, listSeriesForUser, pageSpecForGag, pageSpecOf } from '@/db/queries/series';
import { runHeavy } from '@/lib/workers/pool';
import { findVolume, listEntries, unplacedGags } from '@/db/queries/volumes';
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

export async function loadSeriesPage(seriesId: string, returnTo: string) {
  return seriesAccess(seriesId, returnTo);
}

export async function loadBoard(seriesId: string) {
  const base = await seriesAccess(seriesId, `/series/${seriesId}`);
  const db = await getDb();
  return { ...base, gags: await listGags(db, seriesId), spec: await pageSpecOf(db, seriesId) };
}

export async function loadGag(seriesId: string, gagId: string) {
  const base = await seriesAccess(seriesId, `/series/${seriesId}/gags/${gagId}`);
  const db = await getDb();
  const gag = await findGag(db, gagId);
  if (!gag || gag.seriesId !== seriesId) notFound();
  return { ...base, gag, passes: await listPasses(db, gagId), spec: await pageSpecForGag(db, seriesId, gagId) };
}

export async function loadPassEditor(seriesId: string, gagId: string, passNo: number) {
  const base = await loadGag(seriesId, gagId);
  const db = await getDb();
  if (!Number.isInteger(passNo) || passNo < 1) notFound();
  // The pass's identity only: the editor reads its strokes itself, packed, after the page loads.
  const pass = await findPassByNumber(db, gagId, passNo);
  if (!pass) notFound();
  const passes = await listPasses(db, gagId);
  return {
    ...base,
    pass: { id: pass.id, number: pass.number },
    spec: await pageSpecForGag(db, seriesId, gagId),
    passNumbers: passes.map((p) => p.number),
    passList: passes.map((p) => ({ id: p.id, number: p.number })),
  };
}

/** Every pass of a gag as a small SVG page (drawn on the server, in a worker thread). */
export async function loadPassThumbnails(seriesId: string, gagId: string) {
  return runHeavy('gagPassSvgs', { seriesId, gagId });
}

export async function loadVolume(seriesId: string, volumeId: string) {
  const base = await seriesAccess(seriesId, `/series/${seriesId}/volumes/${volumeId}`);
  const db = await getDb();
  const volume = await findVolume(db, volumeId);
  if (!volume || volume.seriesId !== seriesId) notFound();
  return { ...base, volume: { ...volume, entries: await listEntries(db, volumeId), unplaced: await unplacedGags(db, seriesId) } };
}
