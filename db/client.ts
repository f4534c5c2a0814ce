// One Kysely instance per process over better-sqlite3, chosen by DATABASE_URL
// (default file:./data/quadrille.sqlite). Migrations run before first use.
import fs from 'node:fs';
import path from 'node:path';
import SqliteDatabase from 'better-sqlite3';
import { CamelCasePlugin, Kysely, Migrator, SqliteDialect } from 'kysely';
import type { Database } from './database';
import { migrationProvider } from './migrations';

export const DEFAULT_DATABASE_URL = 'file:./data/quadrille.sqlite';

export type DbKind = 'sqlite';

/** Resolves `file:relative/or/absolute.sqlite` to a path on disk. */
export function sqlitePathFromUrl(url: string): string {
  if (!url.startsWith('file:')) {
    throw new Error(
      `DATABASE_URL must be a file: URL for SQLite (got "${url.split(':')[0]}:…"); PostgreSQL support arrives with multi-instance deployments.`,
    );
  }
  const raw = url.slice('file:'.length).replace(/^\/\/(?=\/)/, '');
  return path.resolve(raw);
}

/** Opens SQLite with the pragmas that make an acknowledged write durable. */
export function openSqlite(file: string): SqliteDatabase.Database {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = new SqliteDatabase(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  // FULL: the WAL is synced on every commit, so an acknowledged write survives a power cut.
  sqlite.pragma('synchronous = FULL');
  sqlite.pragma('busy_timeout = 5000');
  return sqlite;
}

export function createDb(url = process.env.DATABASE_URL || DEFAULT_DATABASE_URL): Kysely<Database> {
  return new Kysely<Database>({
    dialect: new SqliteDialect({ database: openSqlite(sqlitePathFromUrl(url)) }),
    plugins: [new CamelCasePlugin()],
  });
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

export function dbKind(): DbKind {
  return 'sqlite';
}

/** For tests and scripts: close the shared connection. */
export async function closeDb(): Promise<void> {
  const holder = globalForDb.__quadrilleDb;
  globalForDb.__quadrilleDb = undefined;
  if (holder) await holder.db.destroy();
}
