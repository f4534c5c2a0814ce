// The SQLite checkpointer's thread (db/checkpointer.ts): its own connection to the app's file,
// copying the write-ahead log back into the database every so often. A PASSIVE checkpoint takes
// no lock anyone waits for: it copies what no reader still needs and leaves the rest for next time.
import { parentPort, workerData } from 'node:worker_threads';
import Database from 'better-sqlite3';

const db = new Database(workerData.file, { fileMustExist: true });
db.pragma('busy_timeout = 0');
const timer = setInterval(() => {
  try {
    db.pragma('wal_checkpoint(PASSIVE)');
  } catch {
    // Busy or closing: the next round tries again.
  }
}, workerData.everyMs);
parentPort?.on('message', (m) => {
  if (m !== 'stop') return;
  clearInterval(timer);
  db.close();
  parentPort?.close();
});
