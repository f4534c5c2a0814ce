// Passes and their strokes, kept as an append-only log (shared/STROKES.md).
// - A stroke id may have several rows over time; at most one is live
//   (removed_seq null). A client "add" of an id that already has a row or a
//   tombstone is ignored: adds are idempotent and a removal beats an add.
// - Moves add one stroke_moves row per stroke and bump the row's offset.
// - The state at seq K is the rows added at or before K and not removed by K,
//   each shifted by its moves up to K. Nothing is physically deleted.
// Reading and starting passes are here; applying a batch is in ./batches.ts.
import { randomUUID } from 'node:crypto';
import type { Kysely, Transaction } from 'kysely';
import type { Lightbox, Room, Stroke } from '@/lib/strokes/types';
import type { Database } from '../database';
import { lockRow } from '../dialect';
import { recordActivity } from './activity';
import { LIGHTBOXES, ROOMS, copyItems, itemsDelta, liveItems } from './pass-items';
import { passWithGag } from './pass-info';
import { recountPass } from './pass-size';
import { addRevision } from './revisions';
import { rowToStroke, strokeRowValues } from './stroke-rows';
import { Refused } from '@/lib/refused';
import { keptQuery } from '../kept-query';

type Db = Kysely<Database> | Transaction<Database>;

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

const passRow = keptQuery((db, passId: string) => db.selectFrom('passes').selectAll().where('id', '=', passId));

export async function findPass(db: Db, passId: string) {
  const [row] = await passRow(db, passId);
  return row;
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
