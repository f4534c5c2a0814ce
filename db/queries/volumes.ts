// Volumes, their running order and what follows from it (flatplan, plan).
import { randomUUID } from 'node:crypto';
import { generateKeyBetween } from 'fractional-indexing';
import type { Kysely, Selectable, Transaction } from 'kysely';
import { type GagStatus } from '@/lib/gags/status';
import {
  DEFAULT_VOLUME_SPEC,
  type Spread,
  type VolumeSpec,
  blankSuggestion,
  blanksNeeded,
  pageCountValid,
  printerSpreads,
  readerSpreads,
  sheetsNeeded,
  bookSpineMm,
} from '@/lib/print/book';
import { DEFAULT_HOURS, type PlanPage, type Stage, plan } from '@/lib/planning/plan';
import type { Fit, ScanColour } from '@/lib/print/final-fit';
import type { Database, EntryKind, VolumesTable } from '../database';
import { lockRow } from '../dialect';
import { Refused } from '@/lib/refused';
import { syncArtStatus } from './art-status';
import { keptQuery } from '../kept-query';

export type VolumeDto = {
  id: string;
  seriesId: string;
  title: string;
  deadline: string;
  hoursPerWeek: number;
  spec: VolumeSpec;
  hoursPerPage: Record<Stage, number>;
};

export type EntryDto = {
  id: string;
  kind: EntryKind;
  gagId: string | null;
  position: string;
  title: string | null;
  status: GagStatus | null;
  latestPass: { id: string; seq: number } | null;
  /** A matter page marked done (the planner counts no more hours for it); false for a gag's page. */
  done: boolean;
};

function toDto(row: Selectable<VolumesTable>): VolumeDto {
  return {
    id: row.id,
    seriesId: row.seriesId,
    title: row.title,
    deadline: row.deadline,
    hoursPerWeek: row.hoursPerWeek,
    spec: { ...DEFAULT_VOLUME_SPEC, ...(JSON.parse(row.spec) as Partial<VolumeSpec>) },
    hoursPerPage: { ...DEFAULT_HOURS, ...(JSON.parse(row.hoursPerPage) as Partial<Record<Stage, number>>) },
  };
}

export async function listVolumes(db: Kysely<Database>, seriesId: string): Promise<VolumeDto[]> {
  const rows = await db.selectFrom('volumes').selectAll().where('seriesId', '=', seriesId).orderBy('createdAt').execute();
  return rows.map(toDto);
}

export async function findVolume(db: Kysely<Database>, id: string): Promise<VolumeDto | undefined> {
  const row = await db.selectFrom('volumes').selectAll().where('id', '=', id).executeTakeFirst();
  return row ? toDto(row) : undefined;
}

const volumeSeries = keptQuery((db, id: string) => db.selectFrom('volumes').select('seriesId').where('id', '=', id));

export async function seriesOfVolume(db: Kysely<Database>, id: string): Promise<string | null> {
  const [row] = await volumeSeries(db, id);
  return row?.seriesId ?? null;
}

export async function createVolume(
  db: Kysely<Database>,
  input: { seriesId: string; title: string; deadline: string; hoursPerWeek?: number; spec?: Partial<VolumeSpec>; id?: string },
): Promise<VolumeDto> {
  const id = input.id ?? randomUUID();
  await db
    .insertInto('volumes')
    .values({
      id,
      seriesId: input.seriesId,
      title: input.title,
      deadline: input.deadline,
      hoursPerWeek: input.hoursPerWeek ?? 6,
      spec: JSON.stringify({ ...DEFAULT_VOLUME_SPEC, ...input.spec }),
      hoursPerPage: JSON.stringify(DEFAULT_HOURS),
      createdAt: new Date().toISOString(),
    })
    .execute();
  return (await findVolume(db, id))!;
}

export async function updateVolume(
  db: Kysely<Database>,
  id: string,
  patch: { title?: string; deadline?: string; hoursPerWeek?: number; spec?: Partial<VolumeSpec>; hoursPerPage?: Partial<Record<Stage, number>> },
): Promise<VolumeDto> {
  const cur = (await findVolume(db, id))!;
  await db
    .updateTable('volumes')
    .set({
      ...(patch.title !== undefined ? { title: patch.title } : {}),
      ...(patch.deadline !== undefined ? { deadline: patch.deadline } : {}),
      ...(patch.hoursPerWeek !== undefined ? { hoursPerWeek: patch.hoursPerWeek } : {}),
      ...(patch.spec ? { spec: JSON.stringify({ ...cur.spec, ...patch.spec }) } : {}),
      ...(patch.hoursPerPage ? { hoursPerPage: JSON.stringify({ ...cur.hoursPerPage, ...patch.hoursPerPage }) } : {}),
    })
    .where('id', '=', id)
    .execute();
  return (await findVolume(db, id))!;
}

export async function listEntries(db: Kysely<Database>, volumeId: string): Promise<EntryDto[]> {
  const rows = await db
    .selectFrom('volumeEntries as e')
    .leftJoin('gags as g', 'g.id', 'e.gagId')
    .select(['e.id', 'e.kind', 'e.gagId', 'e.position', 'e.doneAt', 'g.title', 'g.status'])
    .where('e.volumeId', '=', volumeId)
    .orderBy('e.position')
    .execute();
  const gagIds = rows.map((r) => r.gagId).filter((x): x is string => !!x);
  const passes = gagIds.length ? await db.selectFrom('passes').select(['id', 'gagId', 'number', 'seq']).where('gagId', 'in', gagIds).execute() : [];
  const latest = new Map<string, { id: string; number: number; seq: number }>();
  for (const p of passes) if (!latest.get(p.gagId) || latest.get(p.gagId)!.number < p.number) latest.set(p.gagId, p);
  return rows.map((r) => {
    const l = r.gagId ? latest.get(r.gagId) : undefined;
    const { doneAt, ...row } = r;
    return { ...row, title: r.title ?? null, status: r.status ?? null, latestPass: l ? { id: l.id, seq: l.seq } : null, done: doneAt !== null };
  });
}

async function lastKey(db: Kysely<Database> | Transaction<Database>, volumeId: string): Promise<string | null> {
  const row = await db
    .selectFrom('volumeEntries')
    .select('position')
    .where('volumeId', '=', volumeId)
    .orderBy('position', 'desc')
    .limit(1)
    .executeTakeFirst();
  return row?.position ?? null;
}

/** Appends a gag page or a matter page at the end of the running order. */
export async function addEntry(
  db: Kysely<Database>,
  volumeId: string,
  seriesId: string,
  input: { gagId?: string; kind?: EntryKind },
): Promise<EntryDto> {
  const id = randomUUID();
  await db.transaction().execute(async (trx) => {
    // Appends to one volume queue (distinct last keys); placing one gag twice at once → one 409.
    await lockRow(trx, 'volumes', volumeId);
    if (input.gagId) await lockRow(trx, 'gags', input.gagId);
    await addEntryLocked(trx, id, volumeId, seriesId, input);
  });
  return (await listEntries(db, volumeId)).find((e) => e.id === id)!;
}

async function addEntryLocked(
  db: Transaction<Database>,
  id: string,
  volumeId: string,
  seriesId: string,
  input: { gagId?: string; kind?: EntryKind },
) {
  if (input.gagId) {
    const gag = await db.selectFrom('gags').select(['seriesId']).where('id', '=', input.gagId).executeTakeFirst();
    if (!gag || gag.seriesId !== seriesId) throw new Refused(422, 'That gag is not in this series.');
    const placed = await db.selectFrom('volumeEntries').select('volumeId').where('gagId', '=', input.gagId).executeTakeFirst();
    if (placed) throw new Refused(409, 'That gag is already placed in a volume; a gag is one page of one book.');
  }
  const position = generateKeyBetween(await lastKey(db, volumeId), null);
  await db
    .insertInto('volumeEntries')
    .values({ id, volumeId, kind: input.gagId ? 'gag' : input.kind!, gagId: input.gagId ?? null, position, createdAt: new Date().toISOString() })
    .execute();
  if (input.gagId) await syncArtStatus(db, input.gagId);
}

/** Takes a page out of the running order; a gag with a fitted final page goes back to "scanned". */
export async function removeEntry(db: Kysely<Database>, volumeId: string, entryId: string): Promise<boolean> {
  return db.transaction().execute(async (trx) => {
    await lockRow(trx, 'volumes', volumeId);
    const entry = await trx.selectFrom('volumeEntries').select('gagId').where('id', '=', entryId).where('volumeId', '=', volumeId).executeTakeFirst();
    if (!entry) return false;
    if (entry.gagId) await lockRow(trx, 'gags', entry.gagId);
    await trx.deleteFrom('volumeEntries').where('id', '=', entryId).execute();
    if (entry.gagId) await syncArtStatus(trx, entry.gagId);
    return true;
  });
}

/** Marks a matter page done or not; a gag's page is done by its status (422). */
export async function setMatterDone(db: Kysely<Database>, volumeId: string, entryId: string, done: boolean): Promise<void> {
  const entry = await db.selectFrom('volumeEntries').select(['kind']).where('id', '=', entryId).where('volumeId', '=', volumeId).executeTakeFirst();
  if (!entry) throw new Refused(404, 'Not found.');
  if (entry.kind === 'gag') throw new Refused(422, 'A gag’s page is done when its status says so (scanned, placed); move the gag instead.');
  await db
    .updateTable('volumeEntries')
    .set({ doneAt: done ? new Date().toISOString() : null })
    .where('id', '=', entryId)
    .execute();
}

/**
 * Moves one entry next to another: one row is rewritten, whatever the length
 * of the running order (a new fractional key between its new neighbours).
 */
export async function moveEntry(db: Kysely<Database>, volumeId: string, entryId: string, to: { before?: string; after?: string }) {
  return db.transaction().execute(async (trx) => {
    // Moves in one volume queue: two at once never compute a key from the same neighbours.
    await lockRow(trx, 'volumes', volumeId);
    const me = await trx
      .selectFrom('volumeEntries')
      .select(['id', 'position'])
      .where('id', '=', entryId)
      .where('volumeId', '=', volumeId)
      .executeTakeFirst();
    if (!me) throw new Refused(404, 'Not found.');
    const anchorId = to.after ?? to.before!;
    if (anchorId === entryId) return me.position;
    const anchor = await trx
      .selectFrom('volumeEntries')
      .select(['id', 'position'])
      .where('id', '=', anchorId)
      .where('volumeId', '=', volumeId)
      .executeTakeFirst();
    if (!anchor) throw new Refused(422, 'The entry to move next to is not in this volume.');
    let lo: string | null;
    let hi: string | null;
    // The other side of the gap is the anchor's neighbour in that direction, leaving out the entry that moves.
    const neighbour = async (dir: 'next' | 'previous') =>
      (
        await trx
          .selectFrom('volumeEntries')
          .select('position')
          .where('volumeId', '=', volumeId)
          .where('position', dir === 'next' ? '>' : '<', anchor.position)
          .where('id', '!=', entryId)
          .orderBy('position', dir === 'next' ? 'asc' : 'desc')
          .limit(1)
          .executeTakeFirst()
      )?.position ?? null;
    if (to.after) {
      lo = anchor.position;
      hi = await neighbour('next');
    } else {
      hi = anchor.position;
      lo = await neighbour('previous');
    }
    const position = generateKeyBetween(lo, hi);
    await trx.updateTable('volumeEntries').set({ position }).where('id', '=', entryId).execute();
    return position;
  });
}

/**
 * A page's current final page as the flatplan draws it: the scan's size and its fit are
 * all the placement geometry needs (lib/print/final-fit); `version` names the scan's bytes,
 * so the preview's address changes only when the scan does.
 */
export type FlatplanFinal = { id: string; fit: Fit; width: number; height: number; colour: ScanColour; version: string };

export type Flatplan = {
  pages: {
    number: number;
    kind: EntryKind;
    gagId?: string;
    entryId: string;
    title: string | null;
    status: GagStatus | null;
    latestPass: { id: string; seq: number } | null;
    /** The page's current final page; null while it has none (the newest pass, if any, stands in: "not final"). */
    final: FlatplanFinal | null;
  }[];
  spreads: Spread[];
  pageCountValid: boolean;
  blanksNeeded: number;
  blanksAt: number;
  /** Perfect binding only: a saddle-stitched book has no spine (null). */
  spineMm: number | null;
  sheets: number;
  printerSpreads: Spread[];
  notReady: { gagId: string; title: string; status: GagStatus }[];
};

/** `finalOf` gives each entry's current final page (a gag's, or a matter page's own); none without it. */
export function flatplanOf(volume: VolumeDto, entries: EntryDto[], finalOf: (e: EntryDto) => FlatplanFinal | null = () => null): Flatplan {
  const n = entries.length;
  const READY_OR_LATER: GagStatus[] = ['ready_to_ink', 'inked', 'scanned', 'placed'];
  return {
    pages: entries.map((e, i) => ({
      number: i + 1,
      kind: e.kind,
      ...(e.gagId ? { gagId: e.gagId } : {}),
      entryId: e.id,
      title: e.title,
      status: e.status,
      latestPass: e.latestPass,
      final: finalOf(e),
    })),
    spreads: readerSpreads(n, volume.spec.direction),
    pageCountValid: pageCountValid(n, volume.spec.binding),
    blanksNeeded: blanksNeeded(n, volume.spec.binding),
    blanksAt: blankSuggestion(entries.map((e) => e.kind)),
    spineMm: bookSpineMm(n, volume.spec.binding, volume.spec.caliperUm),
    sheets: sheetsNeeded(n, volume.spec.binding),
    printerSpreads: volume.spec.binding === 'saddle' ? printerSpreads(n, volume.spec.direction) : [],
    notReady: entries
      .filter((e) => e.gagId && e.status && !READY_OR_LATER.includes(e.status))
      .map((e) => ({ gagId: e.gagId!, title: e.title!, status: e.status! })),
  };
}

export function planOf(volume: VolumeDto, entries: EntryDto[], today = new Date()) {
  const pages = entries.flatMap((e): PlanPage[] => {
    if (e.kind !== 'gag') return [{ matter: e.kind, done: e.done }];
    return e.status ? [{ status: e.status }] : [];
  });
  return plan({
    pages,
    hoursPerPage: volume.hoursPerPage,
    hoursPerWeek: volume.hoursPerWeek,
    today,
    deadline: new Date(`${volume.deadline}T00:00:00Z`),
  });
}

/** The series' gags not placed in any volume, in board order. */
export async function unplacedGags(db: Kysely<Database>, seriesId: string) {
  return db
    .selectFrom('gags as g')
    .leftJoin('volumeEntries as e', 'e.gagId', 'g.id')
    .select(['g.id', 'g.title', 'g.status'])
    .where('g.seriesId', '=', seriesId)
    .where('e.id', 'is', null)
    .orderBy('g.position')
    .execute();
}

/** A running-order entry of this volume (its kind), or undefined. */
export async function matterEntry(db: Kysely<Database>, volumeId: string, entryId: string) {
  return db.selectFrom('volumeEntries').select(['id', 'kind']).where('id', '=', entryId).where('volumeId', '=', volumeId).executeTakeFirst();
}
