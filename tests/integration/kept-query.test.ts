// Queries compiled once and run with each call's values (db/kept-query.ts), on both databases.
import { beforeAll, describe, expect, it } from 'vitest';
import { keptQuery } from '@/db/kept-query';
import type { GagStatus } from '@/lib/gags/status';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  db = await freshDb();
});

describe('keptQuery', () => {
  it("runs the one compiled statement with each call's own values", async () => {
    let built = 0;
    const gagsOf = keptQuery((d, seriesId: string, status: GagStatus) => {
      built += 1;
      return d.selectFrom('gags').select(['id', 'seriesId']).where('seriesId', '=', seriesId).where('status', '!=', status).orderBy('position');
    });
    for (const series of [DEMO_SERIES_ID, OTHER_SERIES_ID, DEMO_SERIES_ID]) {
      const want = await db
        .selectFrom('gags')
        .select(['id', 'seriesId'])
        .where('seriesId', '=', series)
        .where('status', '!=', 'idea')
        .orderBy('position')
        .execute();
      expect(want.length).toBeGreaterThan(0);
      expect(await gagsOf(db, series, 'idea')).toEqual(want);
    }
    expect(await gagsOf(db, 'no-such-series', 'idea')).toEqual([]);
    expect(built).toBe(1);
  });

  it('compiles again inside a transaction (another handle) and sees its writes', async () => {
    const titleOf = keptQuery((d, id: string) => d.selectFrom('gags').select('title').where('id', '=', id));
    const [gag] = await db.selectFrom('gags').select('id').where('seriesId', '=', DEMO_SERIES_ID).limit(1).execute();
    const inside = await db
      .transaction()
      .execute(async (trx) => {
        await trx.updateTable('gags').set({ title: 'Kettle crab, renamed in a transaction' }).where('id', '=', gag!.id).execute();
        const rows = await titleOf(trx, gag!.id);
        throw Object.assign(new Error('roll back'), { rows });
      })
      .catch((e: { rows: unknown }) => e.rows);
    expect(inside).toEqual([{ title: 'Kettle crab, renamed in a transaction' }]);
    expect(await titleOf(db, gag!.id)).not.toEqual(inside);
  });

  it('refuses an argument that shapes the SQL instead of reaching it as a parameter', async () => {
    const bad = keptQuery((d, column: string) =>
      d
        .selectFrom('gags')
        .select('id')
        .orderBy(column as 'id'),
    );
    await expect(bad(db, 'title')).rejects.toThrow(/argument 0 does not reach the SQL/);
  });
});
