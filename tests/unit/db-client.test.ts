import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { createDb, isPostgresUrl, openSqlite, sqlitePathFromUrl } from '@/db/client';
import { kindOf } from '@/db/dialect';

describe('DATABASE_URL', () => {
  it('resolves file: URLs, relative to the working directory or absolute', () => {
    expect(sqlitePathFromUrl('file:./data/quadrille.sqlite')).toBe(path.resolve('data/quadrille.sqlite'));
    expect(sqlitePathFromUrl('file:/tmp/q.sqlite')).toBe('/tmp/q.sqlite');
    expect(sqlitePathFromUrl('file:///tmp/q.sqlite')).toBe('/tmp/q.sqlite');
  });
  it('refuses other schemes with a clear message', () => {
    expect(() => sqlitePathFromUrl('mysql://x')).toThrow(/file: URL for SQLite or a postgres:\/\/ URL/);
  });
  it('selects PostgreSQL for postgres:// and postgresql:// URLs, SQLite for file:', async () => {
    expect(isPostgresUrl('postgres://u@h:5432/q')).toBe(true);
    expect(isPostgresUrl('postgresql://u@h/q')).toBe(true);
    expect(isPostgresUrl('file:./q.sqlite')).toBe(false);
    // The pool connects lazily, so nothing needs to listen on this port.
    const pgDb = createDb('postgres://nobody@127.0.0.1:1/none');
    expect(kindOf(pgDb)).toBe('postgres');
    await pgDb.destroy();
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-kind-'));
    const sqliteDb = createDb(`file:${path.join(dir, 'k.sqlite')}`);
    expect(kindOf(sqliteDb)).toBe('sqlite');
    await sqliteDb.destroy();
  });
});

describe('SQLite connection', () => {
  it('creates the folder and sets the durability pragmas', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-pragma-'));
    const db = openSqlite(path.join(dir, 'nested', 'q.sqlite'));
    // Values as documented at sqlite.org/pragma.html: synchronous FULL = 2.
    expect(db.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(db.pragma('foreign_keys', { simple: true })).toBe(1);
    expect(db.pragma('synchronous', { simple: true })).toBe(2);
    expect(db.pragma('busy_timeout', { simple: true })).toBe(5000);
    db.close();
  });
});
