// The server's SQLite file is checkpointed by a thread of its own: the request thread's commits
// no longer copy the write-ahead log into the database (SQLite's default does, in the commit that
// takes the log past 1,000 pages: https://www.sqlite.org/wal.html#automatic_checkpoint).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { startCheckpointer } from '@/db/checkpointer';
import { openSqlite } from '@/db/client';

describe('the background checkpointer', () => {
  it("copies the log into the database file on its own thread, while the writer's commits copy nothing", async () => {
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-ckpt-')), 'app.sqlite');
    const db = openSqlite(file);
    db.exec('create table notes (body blob)');
    await startCheckpointer(file, async (pages) => db.pragma(`wal_autocheckpoint = ${pages}`));
    expect(db.pragma('wal_autocheckpoint', { simple: true })).toBe(0);
    const before = fs.statSync(file).size;
    // 8 MB in one commit: over 1,000 pages of 4 KB, where SQLite's own commit would checkpoint.
    const insert = db.prepare('insert into notes values (?)');
    db.transaction(() => {
      for (let i = 0; i < 64; i++) insert.run(Buffer.alloc(128 * 1024, i));
    })();
    expect(fs.statSync(`${file}-wal`).size).toBeGreaterThan(8_000_000);
    expect(fs.statSync(file).size).toBe(before); // nothing copied by the commit
    // Within a couple of the checkpointer's rounds (one a second), the database file holds the data.
    await expect.poll(() => fs.statSync(file).size, { timeout: 5000, interval: 200 }).toBeGreaterThan(8_000_000);
    expect(db.prepare('select count(*) as n from notes').get()).toEqual({ n: 64 });
    db.close();
  });
});
