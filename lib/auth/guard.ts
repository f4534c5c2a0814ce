// The one authorization check: every route handler, server action and server
// page goes through authorizeSeries (directly or via lib/http/route.ts).
// Not a member → 404 (the series is not visible to you); member without the
// right → 403.
import { getDb } from '@/db/client';
import { roleInSeries } from '@/db/queries/series';
import { type Action, type Role, can } from './permissions';

export type SeriesAccess = { ok: true; role: Role } | { ok: false; status: 404 | 403; message: string };

export async function authorizeSeries(userId: string, seriesId: string, action: Action): Promise<SeriesAccess> {
  const role = await roleInSeries(await getDb(), userId, seriesId);
  if (!role) return { ok: false, status: 404, message: 'Not found.' };
  if (!can(role, action)) {
    return { ok: false, status: 403, message: `Your role in this series (${role}) does not allow this (${action}).` };
  }
  return { ok: true, role };
}
