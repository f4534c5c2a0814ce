// Final pages: each scan of an inked page is a row, kept for good; one per gag or
// matter page is current. Making one current (an upload, or going back to an earlier
// one) and fitting one move the gag's status through `syncArtStatus`, in the same
// transaction, under the gag's (or the matter page's volume's) row lock.
import { randomUUID } from 'node:crypto';
import type { Kysely, Selectable, Transaction } from 'kysely';
import { type Fit, type Quarter } from '@/lib/print/final-fit';
import { Refused } from '@/lib/refused';
import type { Database, FinalPagesTable } from '../database';
import type { FlatplanFinal } from './volumes';
import { lockRow } from '../dialect';
import { recordActivity } from './activity';
import { syncArtStatus } from './art-status';
import { keptQuery } from '../kept-query';

type Db = Kysely<Database> | Transaction<Database>;
type Row = Selectable<FinalPagesTable>;

/** A final page as the API shows it. */
export type FinalPageDto = {
  id: string;
  gagId: string | null;
  entryId: string | null;
  name: string;
  mime: Row['mime'];
  bytes: number;
  width: number;
  height: number;
  bitsPerPixel: number;
  colour: Row['colour'];
  ppi: number | null;
  fit: Fit;
  fitted: boolean;
  fittedAt: string | null;
  current: boolean;
  by: string;
  createdAt: string;
  madeCurrentAt: string;
  madeCurrentBy: string;
};

/** Who a final page belongs to: a gag, or a matter page of a volume. */
export type FinalOwner = { gagId: string; entryId?: undefined } | { entryId: string; gagId?: undefined };

export const fitOf = (r: Pick<Row, 'fitTo' | 'fitX' | 'fitY' | 'fitScale' | 'fitRotation'>): Fit => ({
  to: r.fitTo,
  x: r.fitX,
  y: r.fitY,
  scale: r.fitScale,
  rotation: r.fitRotation as Quarter,
});

function rows(db: Db) {
  return db
    .selectFrom('finalPages as f')
    .innerJoin('users as u', 'u.id', 'f.createdBy')
    .innerJoin('users as m', 'm.id', 'f.madeCurrentBy')
    .selectAll('f')
    .select(['u.name as byName', 'm.name as madeCurrentByName']);
}

function toDto(r: Row & { byName: string; madeCurrentByName: string }): FinalPageDto {
  return {
    id: r.id,
    gagId: r.gagId,
    entryId: r.entryId,
    name: r.name,
    mime: r.mime,
    bytes: r.bytes,
    width: r.width,
    height: r.height,
    bitsPerPixel: r.bitsPerPixel,
    colour: r.colour,
    ppi: r.ppi,
    fit: fitOf(r),
    fitted: r.fittedAt !== null,
    fittedAt: r.fittedAt,
    current: r.current === 1,
    by: r.byName,
    createdAt: r.createdAt,
    madeCurrentAt: r.madeCurrentAt,
    madeCurrentBy: r.madeCurrentByName,
  };
}

const ownerWhere = (owner: FinalOwner) => (owner.gagId ? (['gagId', owner.gagId] as const) : (['entryId', owner.entryId!] as const));

/** Every final page of a gag or matter page, newest first. */
export async function listFinalPages(db: Db, owner: FinalOwner): Promise<FinalPageDto[]> {
  const [col, id] = ownerWhere(owner);
  const found = await rows(db).where(`f.${col}`, '=', id).orderBy('f.createdAt', 'desc').orderBy('f.id').execute();
  return found.map(toDto);
}

export async function findFinalPage(db: Db, id: string): Promise<FinalPageDto | undefined> {
  const r = await rows(db).where('f.id', '=', id).executeTakeFirst();
  return r ? toDto(r) : undefined;
}

/** The stored row (keys included), for the server only. */
export async function finalPageRow(db: Db, id: string): Promise<Row | undefined> {
  return db.selectFrom('finalPages').selectAll().where('id', '=', id).executeTakeFirst();
}

const finalPageSeries = keptQuery((db, id: string) => db.selectFrom('finalPages').select('seriesId').where('id', '=', id));

export async function seriesOfFinalPage(db: Db, id: string): Promise<string | null> {
  const [row] = await finalPageSeries(db, id);
  return row?.seriesId ?? null;
}

/** The current final pages of these gags and matter pages, by owner id. */
export async function currentFinalPages(db: Db, owners: { gagIds: string[]; entryIds: string[] }): Promise<Map<string, Row>> {
  const out = new Map<string, Row>();
  if (owners.gagIds.length) {
    const found = await db.selectFrom('finalPages').selectAll().where('current', '=', 1).where('gagId', 'in', owners.gagIds).execute();
    for (const r of found) out.set(r.gagId!, r);
  }
  if (owners.entryIds.length) {
    const found = await db.selectFrom('finalPages').selectAll().where('current', '=', 1).where('entryId', 'in', owners.entryIds).execute();
    for (const r of found) out.set(r.entryId!, r);
  }
  return out;
}

/** A current final page as the flatplan draws it (its preview placed by its fit). */
export const flatplanFinalOf = (r: Row): FlatplanFinal => ({
  id: r.id,
  fit: fitOf(r),
  width: r.width,
  height: r.height,
  colour: r.colour,
  version: r.sha256.slice(0, 16),
});

/** Locks what a change of final art reads and writes: the gag, or the matter page's volume. */
async function lockOwner(trx: Transaction<Database>, owner: FinalOwner) {
  if (owner.gagId) return lockRow(trx, 'gags', owner.gagId);
  const e = await trx.selectFrom('volumeEntries').select('volumeId').where('id', '=', owner.entryId!).executeTakeFirst();
  if (!e) throw new Refused(404, 'Not found.');
  await lockRow(trx, 'volumes', e.volumeId);
}

async function makeCurrentLocked(trx: Transaction<Database>, owner: FinalOwner, id: string, userId: string, now: string) {
  const [col, ownerId] = ownerWhere(owner);
  await trx.updateTable('finalPages').set({ current: 0 }).where(col, '=', ownerId).where('current', '=', 1).execute();
  await trx.updateTable('finalPages').set({ current: 1, madeCurrentAt: now, madeCurrentBy: userId }).where('id', '=', id).execute();
  if (owner.gagId) await syncArtStatus(trx, owner.gagId);
}

export type NewFinalPage = Omit<
  FinalPagesTable,
  | 'id'
  | 'gagId'
  | 'entryId'
  | 'current'
  | 'madeCurrentAt'
  | 'madeCurrentBy'
  | 'createdAt'
  | 'fittedAt'
  | 'fittedBy'
  | 'fitTo'
  | 'fitX'
  | 'fitY'
  | 'fitScale'
  | 'fitRotation'
> & { fit: Fit };

/**
 * Records an uploaded final page and makes it current. The same file already in this
 * gag's or matter page's history is not stored twice: that row becomes current again.
 */
export async function addFinalPage(
  db: Kysely<Database>,
  owner: FinalOwner,
  input: NewFinalPage,
): Promise<{ page: FinalPageDto; duplicate: boolean }> {
  const now = new Date().toISOString();
  const [col, ownerId] = ownerWhere(owner);
  const { id, duplicate } = await db.transaction().execute(async (trx) => {
    await lockOwner(trx, owner);
    const same = await trx.selectFrom('finalPages').select('id').where(col, '=', ownerId).where('sha256', '=', input.sha256).executeTakeFirst();
    const id = same?.id ?? randomUUID();
    if (!same) {
      const { fit, ...rest } = input;
      await trx
        .insertInto('finalPages')
        .values({
          ...rest,
          id,
          gagId: owner.gagId ?? null,
          entryId: owner.entryId ?? null,
          fitTo: fit.to,
          fitX: fit.x,
          fitY: fit.y,
          fitScale: fit.scale,
          fitRotation: fit.rotation,
          fittedAt: null,
          fittedBy: null,
          current: 0,
          madeCurrentAt: now,
          madeCurrentBy: input.createdBy,
          createdAt: now,
        })
        .execute();
    }
    await makeCurrentLocked(trx, owner, id, input.createdBy, now);
    if (owner.gagId) {
      const gag = await trx.selectFrom('gags').select('title').where('id', '=', owner.gagId).executeTakeFirstOrThrow();
      await recordActivity(trx, {
        seriesId: input.seriesId,
        gagId: owner.gagId,
        userId: input.createdBy,
        kind: 'final.uploaded',
        summary: `uploaded the final page of “${gag.title}” (${input.width} × ${input.height} px)`,
      });
    }
    return { id, duplicate: !!same };
  });
  return { page: (await findFinalPage(db, id))!, duplicate };
}

/** Goes back to an earlier final page (or forward again): it becomes current; who and when are kept. */
export async function makeFinalPageCurrent(db: Kysely<Database>, id: string, userId: string): Promise<FinalPageDto> {
  await db.transaction().execute(async (trx) => {
    const r = await trx.selectFrom('finalPages').select(['gagId', 'entryId']).where('id', '=', id).executeTakeFirst();
    if (!r) throw new Refused(404, 'Not found.');
    const owner: FinalOwner = r.gagId ? { gagId: r.gagId } : { entryId: r.entryId! };
    await lockOwner(trx, owner);
    await makeCurrentLocked(trx, owner, id, userId, new Date().toISOString());
  });
  return (await findFinalPage(db, id))!;
}

/** A person fits a final page to the page: the fit is stored, it counts as fitted, and the gag's status follows. */
export async function setFit(db: Kysely<Database>, id: string, fit: Fit, userId: string): Promise<FinalPageDto> {
  await db.transaction().execute(async (trx) => {
    const r = await trx.selectFrom('finalPages').select(['gagId', 'entryId']).where('id', '=', id).executeTakeFirst();
    if (!r) throw new Refused(404, 'Not found.');
    await lockOwner(trx, r.gagId ? { gagId: r.gagId } : { entryId: r.entryId! });
    await trx
      .updateTable('finalPages')
      .set({
        fitTo: fit.to,
        fitX: fit.x,
        fitY: fit.y,
        fitScale: fit.scale,
        fitRotation: fit.rotation,
        fittedAt: new Date().toISOString(),
        fittedBy: userId,
      })
      .where('id', '=', id)
      .execute();
    if (r.gagId) await syncArtStatus(trx, r.gagId);
  });
  return (await findFinalPage(db, id))!;
}
