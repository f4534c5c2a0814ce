// The editor's stamp on a pass: "ready to ink" names the exact pass and its
// sequence number; any later change to that pass clears it, and the gag's status
// follows lib/gags/status.ts afterStampCleared (back "in review" from "ready to ink").
import { randomUUID } from 'node:crypto';
import type { Kysely, Transaction } from 'kysely';
import type { Database, StampDecision } from '../database';
import { lockRow } from '../dialect';
import { setGagStatus } from './gag-status';
import { passWithGag } from './pass-info';
import { afterStampCleared } from '@/lib/gags/status';
import { Refused } from '@/lib/refused';

type Db = Kysely<Database> | Transaction<Database>;

export type StampDto = {
  id: string;
  passId: string;
  passNumber: number;
  decision: StampDecision;
  note: string;
  passSeq: number;
  by: string;
  createdAt: string;
  clearedAt: string | null;
  clearedSeq: number | null;
};

const STAMPABLE = new Set(['idea', 'thumbnailing', 'in_review', 'ready_to_ink']);

/**
 * The newest stamp of each gag, for its card on the board: which pass it names,
 * "ready" or "again", and whether a "ready" stamp still stands.
 */
export type StampMark = { passId: string; passNumber: number; decision: StampDecision; standing: boolean };

/** A gag's "ready to ink" stamp that still stands, if any. */
export async function readyStampStands(db: Db, gagId: string): Promise<boolean> {
  const row = await db
    .selectFrom('stamps')
    .select('id')
    .where('gagId', '=', gagId)
    .where('decision', '=', 'ready')
    .where('clearedAt', 'is', null)
    .executeTakeFirst();
  return !!row;
}

/** The pass a gag's standing "ready to ink" stamp approved: the one the drawing desk works from. */
export type ApprovedPass = { gagId: string; passId: string; passNumber: number; passSeq: number; stampedAt: string; by: string };

/** The approved pass of each of these gags that has one (a standing "ready to ink" stamp). */
export async function approvedPasses(db: Db, gagIds: string[]): Promise<Map<string, ApprovedPass>> {
  if (gagIds.length === 0) return new Map();
  const rows = await db
    .selectFrom('stamps as s')
    .innerJoin('passes as p', 'p.id', 's.passId')
    .innerJoin('users as u', 'u.id', 's.userId')
    .select(['s.gagId', 's.passId', 'p.number as passNumber', 's.passSeq', 's.createdAt as stampedAt', 'u.name as by'])
    .where('s.gagId', 'in', gagIds)
    .where('s.decision', '=', 'ready')
    .where('s.clearedAt', 'is', null)
    .execute();
  return new Map(rows.map((r) => [r.gagId, r]));
}

/** Lets every standing "ready to ink" stamp of a gag go (a newer stamp, or a move back to drafting). */
export async function clearReadyStamps(db: Db, gagId: string, now: string): Promise<void> {
  await db
    .updateTable('stamps')
    .set({ clearedAt: now })
    .where('gagId', '=', gagId)
    .where('decision', '=', 'ready')
    .where('clearedAt', 'is', null)
    .execute();
}

export async function stampPass(
  db: Kysely<Database>,
  input: { passId: string; userId: string; decision: StampDecision; note: string },
): Promise<StampDto> {
  const id = await db.transaction().execute(async (trx) => {
    // Stamps and batches on one pass queue on its row: a stamp never names a seq a concurrent batch has passed.
    await lockRow(trx, 'passes', input.passId);
    const pass = await passWithGag(trx, input.passId);
    if (!pass) throw new Error(`No pass ${input.passId}.`);
    // …and stamps of one gag queue on the gag (pass before gag, as a batch that clears a stamp does),
    // so two stamps at once leave one "ready" standing.
    await lockRow(trx, 'gags', pass.gagId);
    if (!STAMPABLE.has(pass.status)) {
      throw new Refused(
        409,
        `This gag is already past "ready to ink" (it is ${pass.status.replace(/_/g, ' ')}); move it back before stamping a pass.`,
      );
    }
    const now = new Date().toISOString();
    // A new stamp supersedes any "ready" stamp still standing on this gag.
    await clearReadyStamps(trx, pass.gagId, now);
    const stampId = randomUUID();
    await trx
      .insertInto('stamps')
      .values({
        id: stampId,
        passId: pass.id,
        gagId: pass.gagId,
        decision: input.decision,
        note: input.note,
        passSeq: pass.seq,
        userId: input.userId,
        createdAt: now,
        clearedAt: null,
        clearedSeq: null,
      })
      .execute();
    await setGagStatus(trx, {
      gagId: pass.gagId,
      to: input.decision === 'ready' ? 'ready_to_ink' : 'thumbnailing',
      userId: input.userId,
      now,
      activity: {
        kind: input.decision === 'ready' ? 'stamp.ready' : 'stamp.again',
        passId: pass.id,
        summary:
          input.decision === 'ready'
            ? `stamped pass ${pass.number} of “${pass.title}” ready to ink`
            : `asked for another pass of “${pass.title}” (after pass ${pass.number})`,
      },
    });
    return stampId;
  });
  return (await stampById(db, id))!;
}

/** Stamps with their pass number and who stamped, as the API shows them. */
function stamps(db: Db) {
  return db
    .selectFrom('stamps as s')
    .innerJoin('passes as p', 'p.id', 's.passId')
    .innerJoin('users as u', 'u.id', 's.userId')
    .select([
      's.id',
      's.passId',
      'p.number as passNumber',
      's.decision',
      's.note',
      's.passSeq',
      'u.name as by',
      's.createdAt',
      's.clearedAt',
      's.clearedSeq',
    ]);
}

async function stampById(db: Db, id: string): Promise<StampDto | undefined> {
  return stamps(db).where('s.id', '=', id).executeTakeFirst();
}

export async function stampsOfGag(db: Db, gagId: string): Promise<StampDto[]> {
  return stamps(db).where('s.gagId', '=', gagId).orderBy('s.createdAt', 'desc').execute();
}

/**
 * Called in the transaction of every change to a pass: a "ready" stamp that
 * approved an earlier state of this pass is cleared, and the gag goes back to
 * "in review". One indexed lookup per batch.
 */
export async function clearStampOnChange(trx: Transaction<Database>, passId: string, seq: number, userId: string | null): Promise<boolean> {
  const stamp = await trx
    .selectFrom('stamps')
    .select(['id', 'gagId', 'passSeq'])
    .where('passId', '=', passId)
    .where('decision', '=', 'ready')
    .where('clearedAt', 'is', null)
    .executeTakeFirst();
  if (!stamp || stamp.passSeq >= seq) return false;
  const now = new Date().toISOString();
  await trx.updateTable('stamps').set({ clearedAt: now, clearedSeq: seq }).where('id', '=', stamp.id).execute();
  const gag = await trx
    .selectFrom('gags as g')
    .innerJoin('passes as p', 'p.gagId', 'g.id')
    .select(['g.id', 'g.status', 'g.seriesId', 'g.title', 'p.number'])
    .where('p.id', '=', passId)
    .executeTakeFirstOrThrow();
  const after = afterStampCleared(gag.status);
  await setGagStatus(trx, {
    gagId: gag.id,
    to: after.status,
    userId,
    now,
    activity: {
      kind: 'stamp.cleared',
      passId,
      summary: `changed pass ${gag.number} of “${gag.title}” after its “ready to ink” stamp: the stamp is cleared and ${after.says}`,
    },
  });
  return true;
}
