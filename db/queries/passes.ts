// Passes and their strokes, kept as an append-only log (shared/STROKES.md).
// - A stroke id may have several rows over time; at most one is live
//   (removed_seq null). A client "add" of an id that already has a row or a
//   tombstone is ignored: adds are idempotent and a removal beats an add.
// - Moves add one stroke_moves row per stroke and bump the row's offset.
// - The state at seq K is the rows added at or before K and not removed by K,
//   each shifted by its moves up to K. Nothing is physically deleted.
import { randomUUID } from 'node:crypto';
import type { Kysely, Transaction } from 'kysely';
import { type PageSpec, bleedBox } from '@/lib/print/geometry';
import type { Lightbox, Op, Room, Stroke } from '@/lib/strokes/types';
import type { Database } from '../database';
import { lockRow } from '../dialect';
import { recordActivity } from './activity';
import { LIGHTBOXES, ROOMS, copyItems, itemsDelta, liveItems, removeItem, upsertItem } from './pass-items';
import { passWithGag } from './pass-info';
import { type SizeChange, recountPass, sizeAfter } from './pass-size';
import { addRevision } from './revisions';
import { clearStampOnChange } from './stamps';
import { rowToStroke, strokeRowValues } from './stroke-rows';
import { Refused } from '@/lib/refused';

type Db = Kysely<Database> | Transaction<Database>;

/** A pause this long between batches leaves a revision behind. */
export const REVISION_PAUSE_MS = 30_000;
/** …and so does every this-many batches of steady drawing. */
export const REVISION_EVERY_BATCHES = 50;

export type PassSummary = {
  id: string;
  gagId: string;
  number: number;
  seq: number;
  strokeCount: number;
  copiedFrom: number | null;
  createdAt: string;
  updatedAt: string;
};
export type PassState = { id: string; gagId: string; number: number; seq: number; strokes: Stroke[]; rooms: Room[]; lightboxes: Lightbox[] };
export type PassDelta = {
  id: string;
  seq: number;
  since: number;
  strokes: Stroke[];
  removedStrokes: string[];
  rooms: Room[];
  removedRooms: string[];
  lightboxes: Lightbox[];
  removedLightboxes: string[];
};

// ---------- reading ----------

export async function findPass(db: Db, passId: string) {
  return db.selectFrom('passes').selectAll().where('id', '=', passId).executeTakeFirst();
}

export async function findPassByNumber(db: Db, gagId: string, number: number) {
  return db.selectFrom('passes').selectAll().where('gagId', '=', gagId).where('number', '=', number).executeTakeFirst();
}

export async function seriesOfPass(db: Db, passId: string): Promise<string | null> {
  return (await passWithGag(db, passId))?.seriesId ?? null;
}

export async function listPasses(db: Db, gagId: string): Promise<PassSummary[]> {
  const rows = await db
    .selectFrom('passes as p')
    .leftJoin('strokes as s', (j) => j.onRef('s.passId', '=', 'p.id').on('s.removedSeq', 'is', null))
    .select((eb) => [
      'p.id',
      'p.gagId',
      'p.number',
      'p.seq',
      'p.copiedFrom',
      'p.createdAt',
      'p.updatedAt',
      eb.fn.count<number>('s.rowId').as('strokeCount'),
    ])
    .where('p.gagId', '=', gagId)
    .groupBy('p.id')
    .orderBy('p.number')
    .execute();
  return rows.map((r) => ({ ...r, strokeCount: Number(r.strokeCount) }));
}

export async function liveStrokes(db: Db, passId: string): Promise<Stroke[]> {
  return (await liveStrokesOfPasses(db, [passId])).get(passId) ?? [];
}

/** The live strokes of several passes in one query, by pass (for thumbnails side by side). */
export async function liveStrokesOfPasses(db: Db, passIds: string[]): Promise<Map<string, Stroke[]>> {
  const out = new Map<string, Stroke[]>(passIds.map((id) => [id, []]));
  if (passIds.length === 0) return out;
  const rows = await db
    .selectFrom('strokes')
    .select(['passId', 'strokeId', 'panel', 'tool', 'grey', 'size', 'points', 'ox', 'oy'])
    .where('passId', 'in', passIds)
    .where('removedSeq', 'is', null)
    .orderBy('addedSeq')
    .orderBy('rowId')
    .execute();
  for (const r of rows) out.get(r.passId)?.push(rowToStroke(r, r.ox, r.oy));
  return out;
}

/** The live strokes of a pass as stored (points still encoded), in drawing order: for the packed wire format. */
export async function liveStrokeRows(db: Db, passId: string) {
  return db
    .selectFrom('strokes')
    .select(['strokeId', 'panel', 'tool', 'grey', 'size', 'points', 'ox', 'oy'])
    .where('passId', '=', passId)
    .where('removedSeq', 'is', null)
    .orderBy('addedSeq')
    .orderBy('rowId')
    .execute();
}

export async function liveRooms(db: Db, passId: string): Promise<Room[]> {
  return liveItems(db, ROOMS, passId);
}

export async function liveLightboxes(db: Db, passId: string): Promise<Lightbox[]> {
  return liveItems(db, LIGHTBOXES, passId);
}

export async function passState(db: Db, passId: string): Promise<PassState | undefined> {
  const pass = await findPass(db, passId);
  if (!pass) return undefined;
  return {
    id: pass.id,
    gagId: pass.gagId,
    number: pass.number,
    seq: pass.seq,
    strokes: await liveStrokes(db, passId),
    rooms: await liveRooms(db, passId),
    lightboxes: await liveLightboxes(db, passId),
  };
}

/** What changed after `since`, as absolute values: apply removals, then replace by id. */
export async function passDelta(db: Db, passId: string, since: number): Promise<PassDelta | undefined> {
  const pass = await findPass(db, passId);
  if (!pass) return undefined;
  const movedRows = db.selectFrom('strokeMoves').select('rowId').where('passId', '=', passId).where('seq', '>', since);
  const changed = await db
    .selectFrom('strokes')
    .select(['strokeId', 'panel', 'tool', 'grey', 'size', 'points', 'ox', 'oy'])
    .where('passId', '=', passId)
    .where('removedSeq', 'is', null)
    .where((eb) => eb.or([eb('addedSeq', '>', since), eb('rowId', 'in', movedRows)]))
    .orderBy('addedSeq')
    .orderBy('rowId')
    .execute();
  const removed = await db
    .selectFrom('strokes')
    .select('strokeId')
    .distinct()
    .where('passId', '=', passId)
    .where('removedSeq', '>', since)
    .where('addedSeq', '<=', since)
    .execute();
  const rooms = await itemsDelta(db, ROOMS, passId, since);
  const lightboxes = await itemsDelta(db, LIGHTBOXES, passId, since);
  const strokes = changed.map((r) => rowToStroke(r, r.ox, r.oy));
  const stillThere = new Set(strokes.map((s) => s.id));
  return {
    id: pass.id,
    seq: pass.seq,
    since,
    strokes,
    removedStrokes: removed.map((r) => r.strokeId).filter((id) => !stillThere.has(id)),
    rooms: rooms.items,
    removedRooms: rooms.removed,
    lightboxes: lightboxes.items,
    removedLightboxes: lightboxes.removed,
  };
}

// ---------- writing ----------

export async function createPass(
  db: Kysely<Database>,
  input: { gagId: string; userId: string; copyFrom?: number },
): Promise<{ id: string; number: number }> {
  return db.transaction().execute(async (trx) => {
    // Two new passes at once must not both take number max + 1.
    await lockRow(trx, 'gags', input.gagId);
    const last = await trx
      .selectFrom('passes')
      .select((eb) => eb.fn.max('number').as('max'))
      .where('gagId', '=', input.gagId)
      .executeTakeFirst();
    const number = Number(last?.max ?? 0) + 1;
    const id = randomUUID();
    const now = new Date().toISOString();
    let source: Stroke[] = [];
    let sourceRooms: Room[] = [];
    let sourceLightboxes: Lightbox[] = [];
    if (input.copyFrom !== undefined) {
      const from = await findPassByNumber(trx, input.gagId, input.copyFrom);
      if (!from) {
        const message = `There is no pass ${input.copyFrom} to copy.`;
        throw new Refused(422, message, [{ path: ['copyFrom'], message }]);
      }
      source = await liveStrokes(trx, from.id);
      sourceRooms = await liveRooms(trx, from.id);
      sourceLightboxes = await liveLightboxes(trx, from.id);
    }
    const seq = input.copyFrom !== undefined ? 1 : 0;
    await trx
      .insertInto('passes')
      .values({ id, gagId: input.gagId, number, seq, copiedFrom: input.copyFrom ?? null, createdBy: input.userId, createdAt: now, updatedAt: now })
      .execute();
    for (const s of source)
      await trx
        .insertInto('strokes')
        .values(strokeRowValues(id, s, 1, input.userId))
        .execute();
    await recountPass(trx, id);
    await copyItems(trx, ROOMS, sourceRooms, id, 1);
    await copyItems(trx, LIGHTBOXES, sourceLightboxes, id, 1);
    await addRevision(trx, id, seq, input.copyFrom !== undefined ? 'copied' : 'created', input.userId);
    const gag = await trx.selectFrom('gags').select(['seriesId', 'title']).where('id', '=', input.gagId).executeTakeFirstOrThrow();
    await recordActivity(trx, {
      seriesId: gag.seriesId,
      gagId: input.gagId,
      passId: id,
      userId: input.userId,
      kind: 'pass.created',
      summary: `started pass ${number} of “${gag.title}”${input.copyFrom !== undefined ? ` from pass ${input.copyFrom}` : ''}`,
    });
    return { id, number };
  });
}

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

/** Bytes stored for a pass's live strokes (points BLOBs), for the benchmark and tests. */
export async function storedPointBytes(db: Db, passId: string): Promise<number> {
  const row = await db
    .selectFrom('strokes')
    .select((eb) => eb.fn.sum<number>(eb.fn('length', ['points'])).as('bytes'))
    .where('passId', '=', passId)
    .where('removedSeq', 'is', null)
    .executeTakeFirst();
  return Number(row?.bytes ?? 0);
}
