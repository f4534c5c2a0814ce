// Everything that differs between SQLite and PostgreSQL lives here, so queries
// and migrations stay one set for both. Migrations import only this file.
import { type ColumnDefinitionBuilder, type Kysely, PostgresAdapter, type Transaction, sql } from 'kysely';

export type DbKind = 'sqlite' | 'postgres';

const KIND = Symbol.for('quadrille.dbKind');

/**
 * Marks an adapter with its engine. A production build may hold more than one
 * copy of kysely (one per server bundle), so `instanceof PostgresAdapter` alone
 * can answer wrong for a database opened by another bundle; the mark cannot.
 */
export function markAdapter<A extends object>(adapter: A, kind: DbKind): A {
  Object.defineProperty(adapter, KIND, { value: kind });
  return adapter;
}

const VERSION = Symbol.for('quadrille.dataVersion');

/**
 * Gives an adapter a reading of its database's version: a text that changes whenever anything is
 * committed to the database, by this connection or any other (db/unchanged.ts keeps answers by it).
 */
export function markDataVersion<A extends object>(adapter: A, read: () => string): A {
  Object.defineProperty(adapter, VERSION, { value: read });
  return adapter;
}

/** The database's version now, or null when the engine gives no such reading (PostgreSQL). */
export function dataVersion(db: Kysely<any> | Transaction<any>): string | null {
  const read = (db.getExecutor().adapter as unknown as { [VERSION]?: () => string })[VERSION];
  return read ? read() : null;
}

export function kindOf(db: Kysely<any> | Transaction<any>): DbKind {
  const adapter = db.getExecutor().adapter as unknown as { [KIND]?: DbKind };
  return adapter[KIND] ?? (adapter instanceof PostgresAdapter ? 'postgres' : 'sqlite');
}

/**
 * Column types that mean the same on both engines. On SQLite these are exactly
 * the types the first migrations used, so an existing SQLite file sees no change.
 * - float: an 8-byte float (PostgreSQL's `real` is only 4 bytes: mm and order keys would drift)
 * - bytes: stroke points (BLOB / bytea)
 * - epochMs: milliseconds since 1970 (beyond a 4-byte integer)
 */
export function columnTypes(db: Kysely<any>) {
  const pg = kindOf(db) === 'postgres';
  return {
    float: pg ? ('double precision' as const) : ('real' as const),
    bytes: pg ? ('bytea' as const) : ('blob' as const),
    epochMs: pg ? ('bigint' as const) : ('integer' as const),
  };
}

/** An integer primary key the database numbers itself (AUTOINCREMENT / identity). */
export function autoId(db: Kysely<any>) {
  const pg = kindOf(db) === 'postgres';
  return (c: ColumnDefinitionBuilder) => (pg ? c.primaryKey().generatedByDefaultAsIdentity() : c.primaryKey().autoIncrement());
}

/**
 * Text compared byte by byte (fractional order keys rely on ASCII order). SQLite's
 * default collation is already binary; PostgreSQL's follows the cluster's locale.
 */
export function byteOrdered(db: Kysely<any>) {
  const pg = kindOf(db) === 'postgres';
  return (c: ColumnDefinitionBuilder) => (pg ? c.modifyFront(sql`collate "C"`) : c);
}

/**
 * Takes the write lock on one row for the rest of the transaction, so writers
 * of the same pass, volume or gag queue up and each sees the others' commits.
 * SQLite needs nothing: one connection per process runs one transaction at a
 * time, and write transactions begin IMMEDIATE (see db/client.ts).
 */
export async function lockRow(trx: Transaction<any>, table: 'passes' | 'volumes' | 'gags' | 'invitations' | 'series', id: string): Promise<void> {
  if (kindOf(trx) !== 'postgres') return;
  // NO KEY UPDATE: writers of the row queue, but inserts that only reference it (activity, comments) do not wait.
  await sql`select 1 from ${sql.table(table)} where id = ${id} for no key update`.execute(trx);
}

/** Locks every pass of a gag, in id order: the order batches and stamps lock in (a pass, then its gag). */
export async function lockPassesOf(trx: Transaction<any>, gagId: string): Promise<void> {
  if (kindOf(trx) !== 'postgres') return;
  await sql`select 1 from passes where gag_id = ${gagId} order by id for no key update`.execute(trx);
}

/**
 * Serialises work on an arbitrary key (e.g. sign-in attempts for one address)
 * for the rest of the transaction: a transaction-scoped advisory lock on
 * PostgreSQL; on SQLite the write transaction is already exclusive.
 */
export async function lockKey(trx: Transaction<any>, key: string): Promise<void> {
  if (kindOf(trx) !== 'postgres') return;
  await sql`select pg_advisory_xact_lock(hashtextextended(${key}, 0))`.execute(trx);
}

/** A unique constraint refused the row (SQLite's SQLITE_CONSTRAINT_UNIQUE, PostgreSQL's 23505). */
export function isUniqueViolation(err: unknown): boolean {
  const code = (err as { code?: string } | null)?.code;
  return code === 'SQLITE_CONSTRAINT_UNIQUE' || code === 'SQLITE_CONSTRAINT_PRIMARYKEY' || code === '23505';
}

/** `select … for update` on PostgreSQL; SQLite's IMMEDIATE transaction already holds the write lock. */
export function forUpdate<QB extends { forUpdate(): QB }>(db: Kysely<any> | Transaction<any>, qb: QB): QB {
  return kindOf(db) === 'postgres' ? qb.forUpdate() : qb;
}
