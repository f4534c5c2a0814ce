// What the database holds, as row counts and one content hash per table, on either engine: compared
// before and after a refused request to show it changed nothing. And the cross-series checks: no row
// may tie together things of two different series, whatever ids a body carried.
import { createHash } from 'node:crypto';
import { type Kysely, sql } from 'kysely';
import type { Database } from '@/db/database';
import { dbKind } from '@/db/client';

export type TableState = Record<string, { rows: number; hash: string }>;

async function tableNames(db: Kysely<Database>): Promise<string[]> {
  const r =
    dbKind() === 'postgres'
      ? await sql<{ name: string }>`select table_name as name from information_schema.tables
          where table_schema = current_schema() and table_type = 'BASE TABLE'`.execute(db)
      : await sql<{ name: string }>`select name from sqlite_master where type = 'table' and name not like 'sqlite_%'`.execute(db);
  return r.rows.map((x) => x.name).sort();
}

const canonical = (v: unknown): string => {
  if (v === null || v === undefined) return 'null';
  if (Buffer.isBuffer(v) || v instanceof Uint8Array) return `x${Buffer.from(v).toString('hex')}`;
  if (v instanceof Date) return `d${v.toISOString()}`;
  return JSON.stringify(v);
};

/** Every table's row count and a hash of its rows (order-free: rows are sorted by their text). */
export async function tableState(db: Kysely<Database>): Promise<TableState> {
  const out: TableState = {};
  for (const name of await tableNames(db)) {
    const { rows } = await sql<Record<string, unknown>>`select * from ${sql.table(name)}`.execute(db);
    const lines = rows.map((row) =>
      Object.keys(row)
        .sort()
        .map((k) => `${k}=${canonical(row[k])}`)
        .join('\u0001'),
    );
    lines.sort();
    out[name] = { rows: rows.length, hash: createHash('sha256').update(lines.join('\n')).digest('hex').slice(0, 16) };
  }
  return out;
}

/** The tables whose rows differ between two states. */
export function changedTables(before: TableState, after: TableState): string[] {
  const names = new Set([...Object.keys(before), ...Object.keys(after)]);
  return [...names].filter((n) => before[n]?.hash !== after[n]?.hash).sort();
}

// Each query counts rows that join two series: an entry placing another series' gag, a comment on
// another gag's pass or replying into another gag, a tick of another series' item, a lightbox of
// another series' upload, a stamp naming a gag its pass does not belong to.
const LEAKS = {
  'volume entry → gag of another series': sql<{ n: number }>`select count(*) as n from volume_entries e
    join volumes v on v.id = e.volume_id join gags g on g.id = e.gag_id where g.series_id <> v.series_id`,
  'comment → pass of another gag': sql<{ n: number }>`select count(*) as n from comments c
    join passes p on p.id = c.pass_id where p.gag_id <> c.gag_id`,
  'reply → thread of another gag': sql<{ n: number }>`select count(*) as n from comments c
    join comments t on t.id = c.parent_id where t.gag_id <> c.gag_id`,
  'checklist tick → item of another series': sql<{ n: number }>`select count(*) as n from checklist_ticks t
    join checklist_items i on i.id = t.item_id join passes p on p.id = t.pass_id join gags g on g.id = p.gag_id
    where i.series_id <> g.series_id`,
  'checklist re-check → pass of another gag': sql<{ n: number }>`select count(*) as n from checklist_rechecks r
    join passes p on p.id = r.pass_id join passes f on f.id = r.from_pass_id where f.gag_id <> p.gag_id`,
  'lightbox → upload of another series': sql<{ n: number }>`select count(*) as n from lightboxes l
    join uploads u on u.id = l.upload_id join passes p on p.id = l.pass_id join gags g on g.id = p.gag_id
    where u.series_id <> g.series_id`,
  'stamp → gag of another pass': sql<{ n: number }>`select count(*) as n from stamps s
    join passes p on p.id = s.pass_id where p.gag_id <> s.gag_id`,
};

/** The cross-series ties found, by kind (empty when there are none). */
export async function crossSeriesLeaks(db: Kysely<Database>): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const [name, query] of Object.entries(LEAKS)) {
    const n = Number((await query.execute(db)).rows[0]!.n);
    if (n) out[name] = n;
  }
  return out;
}
