// Whole-value items of a pass — balloon rooms and lightboxes — kept the same
// way: an upsert writes a new row and retires the live one (removed_seq), a
// removal leaves a tombstone so a later upsert of that id is ignored, and the
// state at seq K is the rows added by K and not retired by K. Nothing is
// physically deleted, so revisions can be restored.
import type { Kysely, Transaction } from 'kysely';
import type { Lightbox, Room, Rotation } from '@/lib/strokes/types';
import type { Database, LightboxesTable, RoomsTable } from '../database';

type Db = Kysely<Database> | Transaction<Database>;

type RoomRow = Omit<RoomsTable, 'rowId'> & { rowId: number };
type LightboxRow = Omit<LightboxesTable, 'rowId'> & { rowId: number };

type Kind<Item extends { id: string }, Row extends { rowId: number; addedSeq: number; removedSeq: number | null }> = {
  table: 'rooms' | 'lightboxes';
  tombstones: 'roomTombstones' | 'lightboxTombstones';
  idColumn: 'roomId' | 'lightboxId';
  /** The columns that describe the item (not the pass, id or seqs). */
  values: (item: Item) => Record<string, string | number | null>;
  toItem: (row: Row) => Item;
};

export const ROOMS: Kind<Room, RoomRow> = {
  table: 'rooms',
  tombstones: 'roomTombstones',
  idColumn: 'roomId',
  values: (r) => ({ panel: r.panel, shape: r.shape, x: r.x, y: r.y, w: r.w, h: r.h }),
  toItem: (row) => ({ id: row.roomId, panel: row.panel, shape: row.shape, x: row.x, y: row.y, w: row.w, h: row.h }),
};

export const LIGHTBOXES: Kind<Lightbox, LightboxRow> = {
  table: 'lightboxes',
  tombstones: 'lightboxTombstones',
  idColumn: 'lightboxId',
  values: (l) => ({
    uploadId: l.uploadId,
    panel: l.panel,
    x: l.x,
    y: l.y,
    w: l.w,
    h: l.h,
    rotation: l.rotation,
    opacity: l.opacity,
    visible: l.visible ? 1 : 0,
  }),
  toItem: (row) => ({
    id: row.lightboxId,
    uploadId: row.uploadId,
    panel: row.panel,
    x: row.x,
    y: row.y,
    w: row.w,
    h: row.h,
    rotation: row.rotation as Rotation,
    opacity: row.opacity,
    visible: row.visible === 1,
  }),
};

// The two tables share their shape but not their column names; Kysely cannot
// type a table chosen at run time, so the queries below go through `any`.
const loose = (db: Db) => db as unknown as Kysely<any>;

/** Where a kind of item lives, without its item type. */
type Tables = Pick<Kind<{ id: string }, never>, 'table' | 'tombstones' | 'idColumn'>;

export async function liveItems<I extends { id: string }, R extends { rowId: number; addedSeq: number; removedSeq: number | null }>(
  db: Db,
  kind: Kind<I, R>,
  passId: string,
): Promise<I[]> {
  return (await liveItemsOfPasses(db, kind, [passId])).get(passId) ?? [];
}

/** The live items of several passes in one query, by pass. */
export async function liveItemsOfPasses<I extends { id: string }, R extends { rowId: number; addedSeq: number; removedSeq: number | null }>(
  db: Db,
  kind: Kind<I, R>,
  passIds: string[],
): Promise<Map<string, I[]>> {
  const out = new Map<string, I[]>(passIds.map((id) => [id, []]));
  if (passIds.length === 0) return out;
  const rows = await loose(db)
    .selectFrom(kind.table)
    .selectAll()
    .where('passId', 'in', passIds)
    .where('removedSeq', 'is', null)
    .orderBy('rowId')
    .execute();
  for (const r of rows) out.get(r.passId as string)?.push(kind.toItem(r as R));
  return out;
}

/** Items changed after `since` (live values) and ids taken away after it. */
export async function itemsDelta<I extends { id: string }, R extends { rowId: number; addedSeq: number; removedSeq: number | null }>(
  db: Db,
  kind: Kind<I, R>,
  passId: string,
  since: number,
): Promise<{ items: I[]; removed: string[] }> {
  const changed = await loose(db)
    .selectFrom(kind.table)
    .selectAll()
    .where('passId', '=', passId)
    .where('removedSeq', 'is', null)
    .where('addedSeq', '>', since)
    .orderBy('rowId')
    .execute();
  const gone = await loose(db)
    .selectFrom(kind.table)
    .select(kind.idColumn)
    .distinct()
    .where('passId', '=', passId)
    .where('removedSeq', '>', since)
    .where('addedSeq', '<=', since)
    .execute();
  const items = changed.map((r) => kind.toItem(r as R));
  const still = new Set(items.map((i) => i.id));
  return { items, removed: gone.map((r) => r[kind.idColumn] as string).filter((id) => !still.has(id)) };
}

/** Rows live at `seq`. */
export async function itemRowsAt<R>(db: Db, kind: Tables, passId: string, seq: number): Promise<R[]> {
  return (await loose(db)
    .selectFrom(kind.table)
    .selectAll()
    .where('passId', '=', passId)
    .where('addedSeq', '<=', seq)
    .where((eb) => eb.or([eb('removedSeq', 'is', null), eb('removedSeq', '>', seq)]))
    .orderBy('rowId')
    .execute()) as R[];
}

async function insertItem(trx: Db, kind: Tables, passId: string, id: string, values: Record<string, unknown>, seq: number) {
  await loose(trx)
    .insertInto(kind.table)
    .values({ passId, [kind.idColumn]: id, ...values, addedSeq: seq, removedSeq: null })
    .execute();
}

/** Places or changes an item; ignored once the id has been taken away, and a no-op when nothing changed. */
export async function upsertItem<I extends { id: string }, R extends { rowId: number; addedSeq: number; removedSeq: number | null }>(
  trx: Db,
  kind: Kind<I, R>,
  passId: string,
  seq: number,
  item: I,
): Promise<void> {
  const db = loose(trx);
  const gone = await db.selectFrom(kind.tombstones).select('seq').where('passId', '=', passId).where(kind.idColumn, '=', item.id).executeTakeFirst();
  if (gone) return;
  const live = await db
    .selectFrom(kind.table)
    .selectAll()
    .where('passId', '=', passId)
    .where(kind.idColumn, '=', item.id)
    .where('removedSeq', 'is', null)
    .executeTakeFirst();
  const values = kind.values(item);
  if (live && Object.entries(values).every(([col, v]) => live[col] === v)) return;
  if (live) await db.updateTable(kind.table).set({ removedSeq: seq }).where('rowId', '=', live.rowId).execute();
  await insertItem(trx, kind, passId, item.id, values, seq);
}

export async function removeItem(trx: Db, kind: Tables, passId: string, seq: number, id: string): Promise<void> {
  const db = loose(trx);
  await db
    .insertInto(kind.tombstones)
    .values({ passId, [kind.idColumn]: id, seq })
    .onConflict((oc) => oc.doNothing())
    .execute();
  await db
    .updateTable(kind.table)
    .set({ removedSeq: seq })
    .where('passId', '=', passId)
    .where(kind.idColumn, '=', id)
    .where('removedSeq', 'is', null)
    .execute();
}

/** Copies live items into a new pass at `seq`. */
export async function copyItems<I extends { id: string }, R extends { rowId: number; addedSeq: number; removedSeq: number | null }>(
  trx: Db,
  kind: Kind<I, R>,
  items: I[],
  passId: string,
  seq: number,
): Promise<void> {
  for (const item of items) await insertItem(trx, kind, passId, item.id, kind.values(item), seq);
}

/** Makes the live rows those that were live at `targetSeq`, by retiring and re-adding at `seq`. */
export async function restoreItems(trx: Db, kind: Tables, passId: string, targetSeq: number, seq: number): Promise<void> {
  const target = await itemRowsAt<Record<string, unknown> & { rowId: number }>(trx, kind, passId, targetSeq);
  const live = await loose(trx).selectFrom(kind.table).selectAll().where('passId', '=', passId).where('removedSeq', 'is', null).execute();
  const targetRows = new Set(target.map((r) => r.rowId));
  const liveRows = new Set(live.map((r) => r.rowId as number));
  for (const r of live) {
    if (!targetRows.has(r.rowId)) await loose(trx).updateTable(kind.table).set({ removedSeq: seq }).where('rowId', '=', r.rowId).execute();
  }
  for (const r of target) {
    if (liveRows.has(r.rowId)) continue;
    const { rowId: _row, passId: _pass, addedSeq: _a, removedSeq: _r, [kind.idColumn]: id, ...values } = r;
    await insertItem(trx, kind, passId, id as string, values, seq);
  }
}
