// The board's answer kept while the database is unchanged (db/unchanged.ts, db/queries/gags.ts boardJson):
// whatever commits — this connection, another process's connection to the same file, a transaction rolled
// back — the next read equals a fresh listGags. On PostgreSQL nothing is kept (no version reading).
// What the version rests on is SQLite's documentation: `PRAGMA data_version` changes when another connection
// has committed; `total_changes()` counts the rows this connection has inserted, updated or deleted.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Kysely } from 'kysely';
import { createDb } from '@/db/client';
import type { Database } from '@/db/database';
import { dataVersion } from '@/db/dialect';
import { boardJson, listGags } from '@/db/queries/gags';
import { whileUnchanged } from '@/db/unchanged';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, freshDb, testDbKind } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
let other: Kysely<Database>;
beforeAll(async () => {
  db = await freshDb();
  // A second connection to the same database, as another process or a CLI would have.
  other = createDb(process.env.DATABASE_URL);
});
afterAll(async () => {
  await other?.destroy();
});

const board = async (d: Kysely<Database>, series = DEMO_SERIES_ID) => JSON.parse((await boardJson(d, series)).toString('utf8')) as unknown;
const fresh = async (d: Kysely<Database>, series = DEMO_SERIES_ID) => JSON.parse(JSON.stringify(await listGags(d, series))) as unknown;
const firstGag = async () =>
  (await db.selectFrom('gags').select('id').where('seriesId', '=', DEMO_SERIES_ID).orderBy('position').executeTakeFirstOrThrow()).id;

describe('the board kept while the database is unchanged', () => {
  it('answers what a fresh read answers, after writes by this connection, another one and a rollback', async () => {
    expect(await board(db)).toEqual(await fresh(db));
    const gagId = await firstGag();

    await db.updateTable('gags').set({ title: 'Kettle crab, renamed here' }).where('id', '=', gagId).execute();
    expect(await board(db)).toEqual(await fresh(db));
    expect(JSON.stringify(await board(db))).toContain('Kettle crab, renamed here');

    await other
      .updateTable('beats')
      .set({ note: 'The crab lifts the lid, from another connection' })
      .where('gagId', '=', gagId)
      .where('kind', '=', 'turn')
      .execute();
    expect(JSON.stringify(await board(db))).toContain('The crab lifts the lid, from another connection');
    expect(await board(db)).toEqual(await fresh(db));

    await db
      .transaction()
      .execute(async (trx) => {
        await trx.updateTable('gags').set({ title: 'Never committed' }).where('id', '=', gagId).execute();
        throw new Error('roll back');
      })
      .catch(() => undefined);
    expect(JSON.stringify(await board(db))).not.toContain('Never committed');
    expect(await board(db)).toEqual(await fresh(db));

    // Each series keeps its own answer.
    expect(await board(db, OTHER_SERIES_ID)).toEqual(await fresh(db, OTHER_SERIES_ID));
    expect(await board(db, OTHER_SERIES_ID)).not.toEqual(await board(db));
  });

  it('computes once while nothing commits, and again after any commit in any table', async () => {
    let computed = 0;
    const kept = whileUnchanged(
      async (d, key) => {
        computed += 1;
        return { key, n: computed };
      },
      { max: 8 },
    );
    await kept(db, 'a');
    await kept(db, 'a');
    await kept(db, 'b');
    // On PostgreSQL there is no reading of the database's version: every ask computes.
    const sqlite = testDbKind() === 'sqlite';
    expect(computed).toBe(sqlite ? 2 : 3);
    expect(dataVersion(db) === null).toBe(!sqlite);
    // A commit elsewhere (another connection, an unrelated table) is a change too.
    await other.updateTable('users').set({ name: 'Nell Harrow-Brack' }).where('id', '=', 'demo-user-owner').execute();
    await kept(db, 'a');
    expect(computed).toBe(sqlite ? 3 : 4);
    await kept(db, 'a');
    expect(computed).toBe(sqlite ? 3 : 5);
    // Asks that arrive together share one computation.
    await Promise.all([kept(db, 'c'), kept(db, 'c'), kept(db, 'c')]);
    expect(computed).toBe(sqlite ? 4 : 8);
  });
});
