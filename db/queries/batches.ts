// Applying a batch of operations to a pass's log (shared/STROKES.md): once per
// batch id, in one transaction under the pass's row lock, each op merging like
// any other (adds idempotent, a removal beating an add, moves as offsets), with
// the pass's kept size, its revisions and its ready stamp kept in step.
import type { Kysely, Transaction } from 'kysely';
import { type PageSpec, bleedBox } from '@/lib/print/geometry';
import { Refused } from '@/lib/refused';
import type { Op } from '@/lib/strokes/types';
import type { Database } from '../database';
import { lockRow } from '../dialect';
import { LIGHTBOXES, ROOMS, removeItem, upsertItem } from './pass-items';
import { type SizeChange, sizeAfter } from './pass-size';
import { addRevision } from './revisions';
import { clearStampOnChange } from './stamps';
import { strokeRowValues } from './stroke-rows';

type Db = Kysely<Database> | Transaction<Database>;

/** A pause this long between batches leaves a revision behind. */
export const REVISION_PAUSE_MS = 30_000;
/** …and so does every this-many batches of steady drawing. */
export const REVISION_EVERY_BATCHES = 50;

async function liveStrokeRow(trx: Db, passId: string, strokeId: string) {
  return trx
    .selectFrom('strokes')
    .select(['rowId', 'minX', 'minY', 'maxX', 'maxY', 'ox', 'oy'])
    .where('passId', '=', passId)
    .where('strokeId', '=', strokeId)
    .where('removedSeq', 'is', null)
    .executeTakeFirst();
}

async function applyOp(trx: Transaction<Database>, passId: string, seq: number, op: Op, userId: string, spec: PageSpec, change: SizeChange) {
  switch (op.op) {
    case 'add': {
      const seen =
        (await trx.selectFrom('strokes').select('rowId').where('passId', '=', passId).where('strokeId', '=', op.stroke.id).executeTakeFirst()) ??
        (await trx.selectFrom('strokeTombstones').select('seq').where('passId', '=', passId).where('strokeId', '=', op.stroke.id).executeTakeFirst());
      if (seen) return; // already added, or removed: the removal wins
      await trx
        .insertInto('strokes')
        .values(strokeRowValues(passId, op.stroke, seq, userId))
        .execute();
      change.strokes += 1;
      change.points += op.stroke.points.length;
      return;
    }
    case 'remove': {
      await trx
        .insertInto('strokeTombstones')
        .values({ passId, strokeId: op.strokeId, seq })
        .onConflict((oc) => oc.doNothing())
        .execute();
      const removed = await trx
        .updateTable('strokes')
        .set({ removedSeq: seq })
        .where('passId', '=', passId)
        .where('strokeId', '=', op.strokeId)
        .where('removedSeq', 'is', null)
        .returning('pointCount')
        .execute();
      for (const r of removed) {
        change.strokes -= 1;
        change.points -= r.pointCount;
      }
      return;
    }
    case 'move': {
      if (op.dx === 0 && op.dy === 0) return;
      const b = bleedBox(spec);
      for (const strokeId of op.strokeIds) {
        const row = await liveStrokeRow(trx, passId, strokeId);
        if (!row) continue; // removed meanwhile: the move has nothing to act on
        const ox = row.ox + op.dx;
        const oy = row.oy + op.dy;
        if (row.minX + ox < b.x - 1e-9 || row.minY + oy < b.y - 1e-9 || row.maxX + ox > b.x + b.w + 1e-9 || row.maxY + oy > b.y + b.h + 1e-9) {
          throw new Refused(422, `Moving stroke ${strokeId} by (${op.dx}, ${op.dy}) mm would take it outside the bleed box.`);
        }
        await trx.insertInto('strokeMoves').values({ rowId: row.rowId, passId, seq, dx: op.dx, dy: op.dy }).execute();
        await trx.updateTable('strokes').set({ ox, oy }).where('rowId', '=', row.rowId).execute();
      }
      return;
    }
    case 'room':
      return upsertItem(trx, ROOMS, passId, seq, op.room);
    case 'unroom':
      return removeItem(trx, ROOMS, passId, seq, op.roomId);
    case 'lightbox':
      return upsertItem(trx, LIGHTBOXES, passId, seq, op.lightbox);
    case 'unlightbox':
      return removeItem(trx, LIGHTBOXES, passId, seq, op.lightboxId);
  }
}

/**
 * Applies one batch in one transaction and answers `{ seq }`. A batch id seen
 * before answers what it answered then and changes nothing.
 */
export async function applyBatch(
  db: Kysely<Database>,
  input: { passId: string; batchId: string; ops: Op[]; userId: string; spec: PageSpec; now?: Date },
): Promise<{ seq: number; replayed: boolean; stampCleared: boolean }> {
  return db.transaction().execute(async (trx) => {
    // Writers of one pass queue here, so each batch takes the next seq (no gap, no
    // duplicate), seqs commit in order (a since=seq read cannot miss a lower one),
    // and a retry racing its original sees the original's row below.
    await lockRow(trx, 'passes', input.passId);
    const seen = await trx
      .selectFrom('passBatches')
      .select('result')
      .where('passId', '=', input.passId)
      .where('batchId', '=', input.batchId)
      .executeTakeFirst();
    if (seen) return { ...(JSON.parse(seen.result) as { seq: number }), replayed: true, stampCleared: false };

    const pass = await trx
      .selectFrom('passes')
      .select(['seq', 'updatedAt', 'liveStrokes', 'livePoints'])
      .where('id', '=', input.passId)
      .executeTakeFirstOrThrow();
    const now = input.now ?? new Date();
    const seq = pass.seq + 1;
    const change: SizeChange = { strokes: 0, points: 0 };
    for (const op of input.ops) await applyOp(trx, input.passId, seq, op, input.userId, input.spec, change);
    const size = sizeAfter(
      pass,
      change,
      input.ops.some((op) => op.op === 'add'),
    );

    // Revisions: the state before a pause, and a steady one every N batches.
    const lastRev = await trx
      .selectFrom('revisions')
      .select((eb) => eb.fn.max('seq').as('seq'))
      .where('passId', '=', input.passId)
      .executeTakeFirst();
    const lastRevSeq = Number(lastRev?.seq ?? 0);
    if (pass.seq > lastRevSeq && now.getTime() - Date.parse(pass.updatedAt) >= REVISION_PAUSE_MS) {
      await addRevision(trx, input.passId, pass.seq, 'pause', input.userId);
    } else if (seq - lastRevSeq >= REVISION_EVERY_BATCHES) {
      await addRevision(trx, input.passId, seq, 'steady', input.userId);
    }

    const stampCleared = await clearStampOnChange(trx, input.passId, seq, input.userId);
    const result = { seq };
    await trx
      .updateTable('passes')
      .set({ seq, updatedAt: now.toISOString(), liveStrokes: size.strokes, livePoints: size.points })
      .where('id', '=', input.passId)
      .execute();
    await trx
      .insertInto('passBatches')
      .values({
        passId: input.passId,
        batchId: input.batchId,
        seq,
        userId: input.userId,
        opCount: input.ops.length,
        result: JSON.stringify(result),
        createdAt: now.toISOString(),
      })
      .execute();
    return { ...result, replayed: false, stampCleared };
  });
}
