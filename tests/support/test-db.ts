// A fresh, migrated SQLite database per test file, loaded with the demo scenario.
// Vitest isolates modules per file, so the shared connection in db/client is new here.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { getDb } from '@/db/client';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, seedDemo } from '@/db/seed/demo';

export async function freshDb(opts: { seed?: boolean } = {}) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-test-'));
  process.env.DATABASE_URL = `file:${path.join(dir, 'test.sqlite')}`;
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
