// The one set of migrations means the same on both engines: mm and order
// positions keep 8-byte precision, fractional order keys sort byte by byte,
// ids are numbered by the database, stroke points are binary.
import { sql } from 'kysely';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { freshDb, testDbKind } from '../support/test-db';

let db: Kysely<Database>;
beforeAll(async () => {
  db = await freshDb({ seed: false });
});

async function columnType(table: string, column: string): Promise<{ type: string; collation: string | null }> {
  if (testDbKind() === 'postgres') {
    // (CamelCasePlugin renames the result's keys.)
    const r = await sql<{ dataType: string; collationName: string | null }>`
      select data_type, collation_name from information_schema.columns where table_name = ${table} and column_name = ${column}`.execute(db);
    return { type: r.rows[0]!.dataType, collation: r.rows[0]!.collationName };
  }
  const r = await sql<{ name: string; type: string }>`select name, type from pragma_table_info(${table})`.execute(db);
  return { type: r.rows.find((c) => c.name === column)!.type.toLowerCase(), collation: null };
}

describe('column types', () => {
  it('millimetres and board positions are 8-byte floats (PostgreSQL real would be 4 bytes)', async () => {
    const want = testDbKind() === 'postgres' ? 'double precision' : 'real';
    for (const [t, c] of [
      ['strokes', 'min_x'],
      ['gags', 'position'],
      ['rooms', 'w'],
      ['lightboxes', 'opacity'],
    ] as const) {
      expect((await columnType(t, c)).type).toBe(want);
    }
    // 1/3 mm survives a round trip to 15 significant digits (IEEE 754 binary64), which a 4-byte float would not.
    await db.insertInto('series').values({ id: 's', title: 'S', createdAt: 'now' }).execute();
    await db
      .insertInto('gags')
      .values({ id: 'g', seriesId: 's', title: 'G', premise: '', status: 'idea', position: 1 / 3, createdAt: 'n', updatedAt: 'n' })
      .execute();
    const g = await db.selectFrom('gags').select('position').where('id', '=', 'g').executeTakeFirstOrThrow();
    expect(g.position).toBe(1 / 3);
  });

  it('stroke points are binary and sign-in times are milliseconds beyond 32 bits', async () => {
    expect((await columnType('strokes', 'points')).type).toBe(testDbKind() === 'postgres' ? 'bytea' : 'blob');
    const at = Date.UTC(2027, 2, 13);
    await db.insertInto('signInFailures').values({ email: 'x@quadrille.test', at }).execute();
    const row = await db.selectFrom('signInFailures').select(['id', 'at']).executeTakeFirstOrThrow();
    expect(row.at).toBe(at);
    expect(typeof row.id).toBe('number');
  });

  it('running-order keys compare byte by byte, as fractional-indexing needs ("Z" before "a")', async () => {
    if (testDbKind() === 'postgres') expect((await columnType('volume_entries', 'position')).collation).toBe('C');
    const r = await sql<{ lt: boolean | number }>`select (${'a0Z'} < ${'a0a'}) as lt`.execute(db);
    expect(Boolean(r.rows[0]!.lt)).toBe(true);
  });
});
