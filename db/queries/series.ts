// Series and memberships.
import type { Kysely } from 'kysely';
import type { Role } from '@/lib/auth/permissions';
import { DEFAULT_PAGE_SPEC, type PageSpec } from '@/lib/print/geometry';
import type { Database } from '../database';
import { keptQuery } from '../kept-query';

export type SeriesDto = { id: string; title: string; role: Role };

export async function listSeriesForUser(db: Kysely<Database>, userId: string): Promise<SeriesDto[]> {
  return db
    .selectFrom('memberships as m')
    .innerJoin('series as s', 's.id', 'm.seriesId')
    .select(['s.id', 's.title', 'm.role'])
    .where('m.userId', '=', userId)
    .orderBy('s.createdAt')
    .orderBy('s.title')
    .execute();
}

const membershipRole = keptQuery((db, userId: string, seriesId: string) =>
  db.selectFrom('memberships').select('role').where('userId', '=', userId).where('seriesId', '=', seriesId),
);

export async function roleInSeries(db: Kysely<Database>, userId: string, seriesId: string): Promise<Role | null> {
  const [row] = await membershipRole(db, userId, seriesId);
  return row?.role ?? null;
}

export async function findSeries(db: Kysely<Database>, seriesId: string) {
  return db.selectFrom('series').select(['id', 'title']).where('id', '=', seriesId).executeTakeFirst();
}

/** Creates a series with its creator as owner, in one transaction. */
export async function createSeries(db: Kysely<Database>, input: { id: string; title: string; ownerId: string }): Promise<SeriesDto> {
  const now = new Date().toISOString();
  await db.transaction().execute(async (trx) => {
    await trx.insertInto('series').values({ id: input.id, title: input.title, createdAt: now }).execute();
    await trx.insertInto('memberships').values({ seriesId: input.id, userId: input.ownerId, role: 'owner', createdAt: now }).execute();
  });
  return { id: input.id, title: input.title, role: 'owner' };
}

/** The series' page spec, or the default until the owner sets one. */
export async function pageSpecOf(db: Kysely<Database>, seriesId: string): Promise<PageSpec> {
  const row = await db.selectFrom('series').select('pageSpec').where('id', '=', seriesId).executeTakeFirst();
  if (!row?.pageSpec) return { ...DEFAULT_PAGE_SPEC };
  return { ...DEFAULT_PAGE_SPEC, ...(JSON.parse(row.pageSpec) as Partial<PageSpec>) };
}

export async function setPageSpec(db: Kysely<Database>, seriesId: string, spec: PageSpec): Promise<void> {
  await db
    .updateTable('series')
    .set({ pageSpec: JSON.stringify(spec) })
    .where('id', '=', seriesId)
    .execute();
}

/**
 * The page a gag is drawn on: its volume's spec once it is placed in one (the
 * volume's spec replaces the series default), otherwise the series default.
 */
export async function pageSpecForGag(db: Kysely<Database>, seriesId: string, gagId: string): Promise<PageSpec> {
  const placed = await db
    .selectFrom('volumeEntries as e')
    .innerJoin('volumes as v', 'v.id', 'e.volumeId')
    .select('v.spec')
    .where('e.gagId', '=', gagId)
    .executeTakeFirst();
  if (placed) {
    const v = JSON.parse(placed.spec) as Partial<PageSpec>;
    const base = await pageSpecOf(db, seriesId);
    return {
      trimW: v.trimW ?? base.trimW,
      trimH: v.trimH ?? base.trimH,
      bleed: v.bleed ?? base.bleed,
      safe: v.safe ?? base.safe,
      gutter: v.gutter ?? base.gutter,
    };
  }
  return pageSpecOf(db, seriesId);
}

export async function pageSpecForPass(db: Kysely<Database>, seriesId: string, passId: string): Promise<PageSpec> {
  const pass = await db.selectFrom('passes').select('gagId').where('id', '=', passId).executeTakeFirst();
  return pass ? pageSpecForGag(db, seriesId, pass.gagId) : pageSpecOf(db, seriesId);
}
