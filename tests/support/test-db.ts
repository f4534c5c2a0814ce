// A fresh, migrated database per test file, loaded with the demo scenario:
// SQLite in the `integration` project, PostgreSQL in `integration-pg` (whose
// global setup provides a throwaway cluster). Vitest isolates modules per
// file, so the shared connection in db/client is new here.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { inject } from 'vitest';
import { getDb } from '@/db/client';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, seedDemo } from '@/db/seed/demo';
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

export async function freshDb(opts: { seed?: boolean } = {}) {
  process.env.DATABASE_URL = await freshDatabaseUrl();
  const db = await getDb();
  if (opts.seed !== false) await seedDemo(db);
  return db;
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
