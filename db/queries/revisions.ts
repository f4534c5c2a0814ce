// Revisions of a pass: saved states to look back at and restore. A restore is a
// new state of the pass (rows that differ are tombstoned and re-added), so it can
// itself be undone by restoring the revision kept just before it.
import { randomUUID } from 'node:crypto';
import type { Kysely, Transaction } from 'kysely';
import type { Database, RevisionReason } from '../database';
import { lockRow } from '../dialect';
import { recordActivity } from './activity';
import { LIGHTBOXES, ROOMS, restoreItems } from './pass-items';
import { passWithGag } from './pass-info';
import { recountPass } from './pass-size';
import { clearStampOnChange } from './stamps';
import { rowToStroke, strokeRowValues, strokesAt } from './stroke-rows';

type Db = Kysely<Database> | Transaction<Database>;

export async function addRevision(
  trx: Db,
  passId: string,
  seq: number,
  reason: RevisionReason,
  userId: string | null,
  restoredFrom: string | null = null,
) {
  const id = randomUUID();
  await trx.insertInto('revisions').values({ id, passId, seq, reason, restoredFrom, userId, createdAt: new Date().toISOString() }).execute();
  return id;
}

export type RevisionDto = { id: string; seq: number; reason: RevisionReason; restoredFrom: string | null; createdAt: string; by: string | null };

export async function listRevisions(db: Db, passId: string): Promise<RevisionDto[]> {
  return db
    .selectFrom('revisions as r')
    .leftJoin('users as u', 'u.id', 'r.userId')
    .select(['r.id', 'r.seq', 'r.reason', 'r.restoredFrom', 'r.createdAt', 'u.name as by'])
    .where('r.passId', '=', passId)
    .orderBy('r.seq', 'desc')
    .orderBy('r.createdAt', 'desc')
    .execute();
}

/**
 * Makes the pass look as it did at a revision, by writing a new batch: rows
 * that differ are tombstoned (removed_seq) and re-added from the revision.
 * The state just before is kept as a revision, so restoring it undoes this.
 */
export async function restoreRevision(
  db: Kysely<Database>,
  input: { passId: string; revisionId: string; userId: string },
): Promise<{ seq: number; revisionId: string } | null> {
  return db.transaction().execute(async (trx) => {
    const rev = await trx
      .selectFrom('revisions')
      .selectAll()
      .where('id', '=', input.revisionId)
      .where('passId', '=', input.passId)
      .executeTakeFirst();
    if (!rev) return null;
    await lockRow(trx, 'passes', input.passId);
    const pass = await trx.selectFrom('passes').select(['seq']).where('id', '=', input.passId).executeTakeFirstOrThrow();
    const seq = pass.seq + 1;
    const hasCurrent = await trx
      .selectFrom('revisions')
      .select('id')
      .where('passId', '=', input.passId)
      .where('seq', '=', pass.seq)
      .executeTakeFirst();
    if (!hasCurrent) await addRevision(trx, input.passId, pass.seq, 'before-restore', input.userId);

    const target = await strokesAt(trx, input.passId, rev.seq);
    const live = await trx.selectFrom('strokes').selectAll().where('passId', '=', input.passId).where('removedSeq', 'is', null).execute();
    const liveById = new Map(live.map((r) => [r.strokeId, r]));
    const targetIds = new Set(target.map((t) => t.row.strokeId));

    for (const row of live) {
      if (!targetIds.has(row.strokeId)) await trx.updateTable('strokes').set({ removedSeq: seq }).where('rowId', '=', row.rowId).execute();
    }
    for (const { row, offset } of target) {
      const now = liveById.get(row.strokeId);
      if (now && now.rowId === row.rowId) {
        const dx = offset.dx - now.ox;
        const dy = offset.dy - now.oy;
        if (Math.abs(dx) > 1e-9 || Math.abs(dy) > 1e-9) {
          await trx.insertInto('strokeMoves').values({ rowId: row.rowId, passId: input.passId, seq, dx, dy }).execute();
          await trx.updateTable('strokes').set({ ox: offset.dx, oy: offset.dy }).where('rowId', '=', row.rowId).execute();
        }
        continue;
      }
      if (now) await trx.updateTable('strokes').set({ removedSeq: seq }).where('rowId', '=', now.rowId).execute();
      const stroke = rowToStroke(row, offset.dx, offset.dy);
      await trx
        .insertInto('strokes')
        .values(strokeRowValues(input.passId, stroke, seq, input.userId))
        .execute();
    }

    await recountPass(trx, input.passId);
    await restoreItems(trx, ROOMS, input.passId, rev.seq, seq);
    await restoreItems(trx, LIGHTBOXES, input.passId, rev.seq, seq);

    const now = new Date().toISOString();
    await trx.updateTable('passes').set({ seq, updatedAt: now }).where('id', '=', input.passId).execute();
    await clearStampOnChange(trx, input.passId, seq, input.userId);
    const revisionId = await addRevision(trx, input.passId, seq, 'restore', input.userId, rev.id);
    const info = (await passWithGag(trx, input.passId))!;
    await recordActivity(trx, {
      seriesId: info.seriesId,
      gagId: info.gagId,
      passId: input.passId,
      userId: input.userId,
      kind: 'pass.restored',
      summary: `restored pass ${info.number} of “${info.title}” to revision #${rev.seq}`,
    });
    const result = { seq };
    await trx
      .insertInto('passBatches')
      .values({
        passId: input.passId,
        batchId: `restore-${revisionId}`,
        seq,
        userId: input.userId,
        opCount: 0,
        result: JSON.stringify(result),
        createdAt: now,
      })
      .execute();
    return { seq, revisionId };
  });
}
