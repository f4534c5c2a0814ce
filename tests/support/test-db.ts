// A fresh, migrated database per test file, loaded with the demo scenario:
// SQLite in the `integration` project, PostgreSQL in `integration-pg` (whose
// global setup provides a throwaway cluster). Vitest isolates modules per
// file, so the shared connection in db/client is new here.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { inject } from 'vitest';
import { type Kysely, sql } from 'kysely';
import { getDb } from '@/db/client';
import type { Database } from '@/db/database';
import { startSession } from '@/db/queries/sessions';
import { seedDemo } from '@/db/seed/demo';
import { DEMO_SERIES_ID, OTHER_SERIES_ID } from '@/db/seed/demo-data';
import { createDatabase } from './pg-cluster';

/** The database engine this test file runs on. */
export function testDbKind(): 'sqlite' | 'postgres' {
  return inject('pgAdminUrl') ? 'postgres' : 'sqlite';
}

/** Points DATABASE_URL at a new empty database (not yet opened). */
export async function freshDatabaseUrl(): Promise<string> {
  const pgAdminUrl = inject('pgAdminUrl');
  if (pgAdminUrl) return createDatabase(pgAdminUrl);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-test-'));
  return `file:${path.join(dir, 'test.sqlite')}`;
}

/** How many rows each table holds now (to show that a refused request wrote nothing). */
export async function countRows<T extends keyof Database>(db: Kysely<Database>, tables: T[]): Promise<Record<T, number>> {
  const out = {} as Record<T, number>;
  for (const t of tables) {
    // Any table: counted with plain SQL (the builder's types are per table).
    const r = await sql<{ n: number }>`select count(*) as n from ${sql.table(snakeCase(t))}`.execute(db);
    out[t] = Number(r.rows[0]!.n);
  }
  return out;
}

const snakeCase = (name: string) => name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

export async function freshDb(opts: { seed?: boolean } = {}) {
  process.env.DATABASE_URL = await freshDatabaseUrl();
  const db = await getDb();
  if (opts.seed !== false) {
    await seedDemo(db);
    // Each persona is signed in once, before the test starts: a request made as them changes no table.
    for (const persona of Object.keys(PERSONAS) as (keyof typeof PERSONAS)[]) await personaSession(persona);
  }
  return db;
}

const sessions = new Map<string, string>();

/**
 * The persona's session in this file's database, as a sign-in would have made it (sessions are checked on every
 * request); a new one if a test ended it (a password change, removal from the last series) or moved the clock past it.
 */
export async function personaSession(persona: keyof typeof PERSONAS): Promise<string> {
  const db = await getDb();
  const key = `${process.env.DATABASE_URL} ${persona}`;
  const known = sessions.get(key);
  const live = known
    ? await db.selectFrom('sessions').select('id').where('id', '=', known).where('expiresAt', '>', new Date().toISOString()).executeTakeFirst()
    : undefined;
  if (live) return live.id;
  const id = await startSession(db, PERSONAS[persona].id);
  sessions.set(key, id);
  return id;
}

export const PERSONAS = {
  owner: { id: 'demo-user-owner', email: 'owner@quadrille.test', name: 'Nell Harrow' },
  cocreator: { id: 'demo-user-cocreator', email: 'cocreator@quadrille.test', name: 'Tam Quill' },
  editor: { id: 'demo-user-editor', email: 'editor@quadrille.test', name: 'Ivo Sand' },
  viewer: { id: 'demo-user-viewer', email: 'viewer@quadrille.test', name: 'Bea Lark' },
  outsider: { id: 'demo-user-outsider', email: 'outsider@quadrille.test', name: 'Oskar Fenn' },
} as const;
export type Persona = keyof typeof PERSONAS | 'anonymous';

export { DEMO_SERIES_ID, OTHER_SERIES_ID };
