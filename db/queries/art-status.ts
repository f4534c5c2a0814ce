// The one place a gag's status follows its final art (lib/gags/status.ts#statusFromArt):
// called inside every transaction that changes the art — an upload, going back to an
// earlier scan, a fit, placing the gag in a running order or taking it out.
import type { Kysely, Transaction } from 'kysely';
import { type ArtFacts, type GagStatus, statusFromArt } from '@/lib/gags/status';
import type { Database } from '../database';

type Trx = Transaction<Database>;

export async function artFacts(trx: Trx | Kysely<Database>, gagId: string): Promise<ArtFacts> {
  const current = await trx.selectFrom('finalPages').select('fittedAt').where('gagId', '=', gagId).where('current', '=', 1).executeTakeFirst();
  const entry = await trx.selectFrom('volumeEntries').select('id').where('gagId', '=', gagId).executeTakeFirst();
  return { hasFinalPage: !!current, fitted: !!current?.fittedAt, inRunningOrder: !!entry };
}

/** Moves the gag to the status its art says; returns the new status when it changed. */
export async function syncArtStatus(trx: Trx, gagId: string): Promise<GagStatus | null> {
  const gag = await trx.selectFrom('gags').select('status').where('id', '=', gagId).executeTakeFirst();
  if (!gag) return null;
  const next = statusFromArt(gag.status, await artFacts(trx, gagId));
  if (next === gag.status) return null;
  await trx.updateTable('gags').set({ status: next, updatedAt: new Date().toISOString() }).where('id', '=', gagId).execute();
  return next;
}
