// SQLite writes its changes to a write-ahead log and, by default, copies the log back into the
// database file inside the commit that takes it past 1,000 pages: that commit then does seconds
// of I/O on the request thread (better-sqlite3 is synchronous), and every request waits behind
// it. The server instead turns that off for its own connection and checkpoints from a thread of
// its own (checkpoint-worker.mjs), so no commit carries anyone else's I/O.
import path from 'node:path';
import { Worker } from 'node:worker_threads';

const EVERY_MS = 1000;
const holder = globalThis as unknown as { __quadrilleCheckpointer?: { file: string; worker: Worker } };

/**
 * Starts the checkpointer for the server's SQLite file (once per process); `autoCheckpoint` sets the
 * server connection's own threshold in pages (0: its commits stop checkpointing).
 */
export async function startCheckpointer(file: string, autoCheckpoint: (pages: number) => Promise<unknown>): Promise<void> {
  if (holder.__quadrilleCheckpointer?.file === file) return;
  try {
    const worker = new Worker(path.join(process.cwd(), 'db/checkpoint-worker.mjs'), { workerData: { file, everyMs: EVERY_MS } });
    worker.unref();
    // Should the thread die, the commits checkpoint again, as SQLite does by default.
    worker.on('error', (err) => {
      console.error('[db] checkpointer stopped:', err.message);
      void autoCheckpoint(1000);
    });
    holder.__quadrilleCheckpointer = { file, worker };
    await autoCheckpoint(0);
  } catch (err) {
    console.error('[db] checkpointer not started; commits checkpoint themselves:', (err as Error).message);
  }
}
