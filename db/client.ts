// One Kysely instance per process, chosen by DATABASE_URL: a `file:` URL opens
// SQLite through better-sqlite3 (the default, file:./data/quadrille.sqlite);
// `postgres://` or `postgresql://` opens a pg pool for multi-instance deployments.
// Migrations run before first use.
import fs from 'node:fs';
import path from 'node:path';
import SqliteDatabase from 'better-sqlite3';
import {
  CamelCasePlugin,
  CompiledQuery,
  sql,
  type DatabaseConnection,
  Kysely,
  Migrator,
  PostgresDialect,
  SqliteDialect,
  type SqliteDialectConfig,
  SqliteDriver,
} from 'kysely';
import pg from 'pg';
import type { Database } from './database';
import { type DbKind, kindOf, markAdapter, markDataVersion } from './dialect';
import { startCheckpointer } from './checkpointer';
import { migrationProvider } from './migrations';
import { LRUCache } from 'lru-cache';

export const DEFAULT_DATABASE_URL = 'file:./data/quadrille.sqlite';

export type { DbKind };

export function isPostgresUrl(url: string): boolean {
  return /^postgres(ql)?:\/\//.test(url);
}

/** Resolves `file:relative/or/absolute.sqlite` to a path on disk. */
export function sqlitePathFromUrl(url: string): string {
  if (!url.startsWith('file:')) {
    throw new Error(`DATABASE_URL must be a file: URL for SQLite or a postgres:// URL for PostgreSQL (got "${url.split(':')[0]}:…").`);
  }
  const raw = url.slice('file:'.length).replace(/^\/\/(?=\/)/, '');
  return path.resolve(raw);
}

/** Opens SQLite with the pragmas that make an acknowledged write durable; read-only for a reader beside the app. */
export function openSqlite(file: string, opts: { readOnly?: boolean } = {}): SqliteDatabase.Database {
  if (opts.readOnly) {
    // A reader takes no lock a writer would wait for, and never migrates: the file is the app's, already set up.
    const reader = new SqliteDatabase(file, { readonly: true, fileMustExist: true });
    reader.pragma('busy_timeout = 5000');
    return reader;
  }
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = new SqliteDatabase(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  // FULL: the WAL is synced on every commit, so an acknowledged write survives a power cut.
  sqlite.pragma('synchronous = FULL');
  sqlite.pragma('busy_timeout = 5000');
  return sqlite;
}

// Write transactions take SQLite's write lock at BEGIN: a transaction that read
// first and wrote later could otherwise fail with SQLITE_BUSY_SNAPSHOT when a
// second process (a CLI, a test) writes the same file.
class ImmediateSqliteDriver extends SqliteDriver {
  override async beginTransaction(connection: DatabaseConnection): Promise<void> {
    await connection.executeQuery(CompiledQuery.raw('begin immediate'));
  }
}
/**
 * better-sqlite3 with each statement compiled once: Kysely's SQLite driver prepares every query
 * afresh, and compiling SQL was a tenth of a busy server's time. Statements are kept by their SQL
 * (the most recent 500; lists of ids of other lengths make other SQL) and reused — safe on this one
 * connection, where Kysely runs one query at a time, and SQLite recompiles a statement itself when
 * the schema changes.
 */
export function withStatementCache(db: SqliteDatabase.Database, size = 500): SqliteDialectConfig['database'] {
  const cache = new LRUCache<string, SqliteDatabase.Statement>({ max: size });
  return {
    close: () => {
      cache.clear();
      db.close();
    },
    prepare: (query: string) => {
      let stmt = cache.get(query);
      if (!stmt) {
        stmt = db.prepare(query);
        cache.set(query, stmt);
      }
      return stmt;
    },
  };
}

/**
 * A reading that changes whenever anything is committed to the file: `total_changes()` counts every row this
 * connection has inserted, updated or deleted (triggers' included), and `PRAGMA data_version` changes when
 * any other connection — another process, a CLI — has committed (SQLite's documentation of both). The
 * worker threads' connections are read-only. A count that also moves for a write later rolled back only
 * costs a recomputation.
 */
export function sqliteDataVersion(sqlite: SqliteDatabase.Database): () => string {
  const stmt = sqlite.prepare('select total_changes() as own, (select data_version from pragma_data_version()) as others').raw();
  return () => {
    const [own, others] = stmt.get() as [number, number];
    return `${own}:${others}`;
  };
}

class ImmediateSqliteDialect extends SqliteDialect {
  constructor(
    private readonly sqliteConfig: ConstructorParameters<typeof SqliteDialect>[0],
    private readonly version: () => string,
  ) {
    super(sqliteConfig);
  }
  override createDriver() {
    return new ImmediateSqliteDriver(this.sqliteConfig);
  }
  override createAdapter() {
    return markDataVersion(markAdapter(super.createAdapter(), 'sqlite'), this.version);
  }
}

class MarkedPostgresDialect extends PostgresDialect {
  override createAdapter() {
    return markAdapter(super.createAdapter(), 'postgres');
  }
}

// pg returns 64-bit integers (count(*), bigint columns) and numerics (sum) as
// strings; every value here fits a double, and SQLite gives numbers.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));

export function createPgPool(url: string, max = Number(process.env.DATABASE_POOL_SIZE || 10)): pg.Pool {
  const pool = new pg.Pool({ connectionString: url, max });
  // An idle client that loses its server must not crash the process; the next query reconnects.
  pool.on('error', (err) => console.error('[db] idle PostgreSQL client error:', err.message));
  return pool;
}

/** `readOnly`: a connection for the worker threads' reads (SQLite read-only, a pool of two on PostgreSQL). */
export function createDb(url = process.env.DATABASE_URL || DEFAULT_DATABASE_URL, opts: { readOnly?: boolean } = {}): Kysely<Database> {
  if (isPostgresUrl(url)) {
    const dialect = new MarkedPostgresDialect({ pool: createPgPool(url, opts.readOnly ? 2 : undefined) });
    return new Kysely<Database>({ dialect, plugins: [new CamelCasePlugin()] });
  }
  const sqlite = openSqlite(sqlitePathFromUrl(url), opts);
  const dialect = new ImmediateSqliteDialect({ database: withStatementCache(sqlite) }, sqliteDataVersion(sqlite));
  return new Kysely<Database>({ dialect, plugins: [new CamelCasePlugin()] });
}

/** One round trip to the database: for health checks. */
export async function ping(db: Kysely<Database>): Promise<void> {
  await sql`select 1`.execute(db);
}

export async function migrateToLatest(db: Kysely<any>): Promise<string[]> {
  const migrator = new Migrator({ db, provider: migrationProvider });
  const { error, results } = await migrator.migrateToLatest();
  if (error) throw error instanceof Error ? error : new Error(String(error));
  return (results ?? []).filter((r) => r.status === 'Success').map((r) => r.migrationName);
}

type Holder = { db: Kysely<Database>; ready: Promise<unknown>; url: string };
const globalForDb = globalThis as unknown as { __quadrilleDb?: Holder };

/**
 * The process-wide database, migrated. Kept on globalThis so hot reloads in
 * development reuse one connection.
 */
export async function getDb(): Promise<Kysely<Database>> {
  const url = process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
  let holder = globalForDb.__quadrilleDb;
  if (!holder || holder.url !== url) {
    const db = createDb(url);
    holder = { db, url, ready: migrateToLatest(db) };
    globalForDb.__quadrilleDb = holder;
  }
  await holder.ready;
  return holder.db;
}

/**
 * The server's SQLite file is checkpointed by a thread of its own, not inside the commits of the
 * request thread (db/checkpointer.ts). Nothing to do on PostgreSQL.
 */
export async function checkpointInBackground(): Promise<void> {
  const url = process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
  if (isPostgresUrl(url)) return;
  const db = await getDb();
  await startCheckpointer(sqlitePathFromUrl(url), (pages) => sql.raw(`pragma wal_autocheckpoint = ${Math.round(pages)}`).execute(db));
}

export function dbKind(): DbKind {
  const holder = globalForDb.__quadrilleDb;
  if (holder) return kindOf(holder.db);
  return isPostgresUrl(process.env.DATABASE_URL || DEFAULT_DATABASE_URL) ? 'postgres' : 'sqlite';
}

/** For tests and scripts: close the shared connection. */
export async function closeDb(): Promise<void> {
  const holder = globalForDb.__quadrilleDb;
  globalForDb.__quadrilleDb = undefined;
  if (holder) await holder.db.destroy();
}
