// Every change of a gag's status goes through here, with the activity entry that tells it, in the
// caller's transaction: a move by hand, a stamp, a stamp cleared by a later change. So the board's
// status and the activity feed cannot disagree about how a gag got where it is.
import type { Transaction } from 'kysely';
import { type GagStatus, STATUS_LABELS } from '@/lib/gags/status';
import type { Database } from '../database';
import { type ActivityKind, recordActivity } from './activity';

export type StatusChange = {
  gagId: string;
  to: GagStatus;
  userId: string | null;
  now?: string;
  /** What the activity says; by default "moved “Title” from A to B" (kind `gag.moved`), and only if it moved. */
  activity?: { kind: ActivityKind; summary: string; passId?: string | null };
};

/** Sets the status and records the activity (nothing at all for a "move" to where the gag already is); returns the status it had. */
export async function setGagStatus(trx: Transaction<Database>, c: StatusChange): Promise<GagStatus> {
  const gag = await trx.selectFrom('gags').select(['status', 'seriesId', 'title']).where('id', '=', c.gagId).executeTakeFirstOrThrow();
  const now = c.now ?? new Date().toISOString();
  if (gag.status !== c.to || c.activity) await trx.updateTable('gags').set({ status: c.to, updatedAt: now }).where('id', '=', c.gagId).execute();
  const activity =
    c.activity ??
    (gag.status !== c.to
      ? { kind: 'gag.moved' as const, summary: `moved “${gag.title}” from ${STATUS_LABELS[gag.status]} to ${STATUS_LABELS[c.to]}` }
      : null);
  if (activity) {
    await recordActivity(trx, {
      seriesId: gag.seriesId,
      gagId: c.gagId,
      passId: activity.passId ?? null,
      userId: c.userId,
      kind: activity.kind,
      summary: activity.summary,
    });
  }
  return gag.status;
}
