// Live changes between app instances: publish after a change commits; every
// instance's open streams (lib/live/stream.ts) hear it. On PostgreSQL the
// fan-out is LISTEN/NOTIFY (db/notify.ts), so it reaches every instance; on
// SQLite (one instance by design) an in-process emitter does the same job.
// Events only say what changed (a topic, a seq, ids): clients then read the
// data through the JSON routes, so a lost event costs a little delay, never data.
import 'server-only';
import { EventEmitter } from 'node:events';
import { DEFAULT_DATABASE_URL, getDb, isPostgresUrl } from '@/db/client';
import { MAX_NOTIFY_BYTES, type Listener, listen, pgNotify } from '@/db/notify';

/**
 * Topics: `pass:<id>` (a pass's strokes, rooms, lightboxes), `gag:<id>` (its page:
 * passes, comments, stamps, checklist, presence), `series:<id>` (board and
 * activity), `user:<id>` (that person's access changed).
 * `type` says what changed; `seq` is a pass's new sequence number.
 */
export type LiveEvent = { topic: string; type: string; seq?: number; ids?: string[]; data?: unknown };

/** Sent to every subscriber when the fan-out itself was interrupted: catch up from the database. */
export const RESYNC: LiveEvent = { topic: '*', type: 'resync' };

type Bus = { url: string; emitter: EventEmitter; listener: Listener | null; ready: Promise<void> | null };
const g = globalThis as unknown as { __quadrilleBus?: Bus };

function bus(): Bus {
  const url = process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
  if (!g.__quadrilleBus || g.__quadrilleBus.url !== url) {
    void g.__quadrilleBus?.listener?.close();
    const emitter = new EventEmitter();
    emitter.setMaxListeners(0);
    g.__quadrilleBus = { url, emitter, listener: null, ready: null };
  }
  return g.__quadrilleBus;
}

function deliver(b: Bus, events: LiveEvent[]) {
  for (const e of events) {
    if (e.topic === '*') b.emitter.emit('*', e);
    else b.emitter.emit(e.topic, e);
  }
}

function ensureListening(b: Bus): Promise<void> {
  if (!isPostgresUrl(b.url)) return Promise.resolve();
  b.ready ??= new Promise<void>((resolve) => {
    b.listener = listen(
      b.url,
      (payload) => {
        try {
          deliver(b, JSON.parse(payload) as LiveEvent[]);
        } catch {
          /* not ours */
        }
      },
      (first) => {
        if (!first) deliver(b, [RESYNC]);
        resolve();
      },
    );
  });
  return b.ready;
}

/** Tells every instance about committed changes. Never throws: a lost event only delays a client. */
export async function publish(...events: LiveEvent[]): Promise<void> {
  if (events.length === 0) return;
  const b = bus();
  try {
    if (!isPostgresUrl(b.url)) {
      deliver(b, events);
      return;
    }
    const db = await getDb();
    // One NOTIFY per chunk that fits PostgreSQL's payload limit.
    let chunk: LiveEvent[] = [];
    for (const e of events) {
      if (chunk.length && JSON.stringify([...chunk, e]).length > MAX_NOTIFY_BYTES) {
        await pgNotify(db, JSON.stringify(chunk));
        chunk = [];
      }
      chunk.push(e);
    }
    await pgNotify(db, JSON.stringify(chunk));
  } catch (err) {
    console.error('[live] publish failed:', (err as Error).message);
  }
}

/** Calls `fn` for each event on these topics (and for RESYNC). Resolves once events will arrive. */
export async function subscribe(topics: string[], fn: (e: LiveEvent) => void): Promise<() => void> {
  const b = bus();
  for (const t of topics) b.emitter.on(t, fn);
  b.emitter.on('*', fn);
  const off = () => {
    for (const t of topics) b.emitter.off(t, fn);
    b.emitter.off('*', fn);
  };
  await ensureListening(b);
  return off;
}
