// One Server-Sent Events stream for what a page watches (a pass in the editor,
// a gag page, a series board). It forwards the bus's events for its topics,
// starts with a "hello" that lets the client catch up (e.g. the pass's seq),
// beats every HEARTBEAT_MS (a comment line proxies and browsers can see), and at
// every beat checks again that the person may still read: a member removed while
// the stream is open stops receiving within one heartbeat (at once when the
// removal is published). A stream that says where its tab is keeps that tab's
// presence row fresh, sends the gag's presence list, and deletes the row when the
// tab goes away.
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { randomUUID } from 'node:crypto';
import { beat, beatIfAbsent, leave, present, touch } from '@/db/queries/presence';
import { type LiveEvent, publish, subscribe } from './bus';

export function heartbeatMs(): number {
  return Number(process.env.LIVE_HEARTBEAT_MS) || 15_000;
}

export const STREAM_HEADERS = {
  'content-type': 'text/event-stream; charset=utf-8',
  // no-transform: no proxy or compression layer may hold events back to compress them.
  'cache-control': 'no-cache, no-transform',
  connection: 'keep-alive',
  // nginx and others buffer responses unless told not to.
  'x-accel-buffering': 'no',
};

export type StreamPresence = { gagId: string; tabId: string; where: string; panel: number | null };

export type StreamOptions = {
  req: Request;
  db: Kysely<Database>;
  userId: string;
  topics: string[];
  /** Sent first on every (re)connection, e.g. the pass's current seq. */
  hello?: () => Promise<LiveEvent[]>;
  /** False when the person may no longer read what the stream shows: the stream ends. */
  allowed: () => Promise<boolean>;
  presence?: StreamPresence;
};

/** SSE framing: a pass's seq doubles as the event id. */
export function frame(e: LiveEvent): string {
  const id = e.seq !== undefined ? `id: ${e.seq}\n` : '';
  return `${id}data: ${JSON.stringify(e)}\n\n`;
}

export function liveStream(o: StreamOptions): Response {
  const enc = new TextEncoder();
  let closed = false;
  let off: (() => void) | null = null;
  let timer: ReturnType<typeof setInterval> | null = null;
  let controllerRef: ReadableStreamDefaultController<Uint8Array> | null = null;
  const presenceTopic = o.presence ? `gag:${o.presence.gagId}` : null;
  /** This connection's mark on its presence row: a reconnect of the same tab takes the row over, and our close leaves it alone. */
  const connId = randomUUID();
  const mark = () => ({ ...o.presence!, userId: o.userId, connId });

  const send = (text: string) => {
    if (closed || !controllerRef) return;
    try {
      controllerRef.enqueue(enc.encode(text));
    } catch {
      void close();
    }
  };
  const sendPresence = async () => {
    if (!o.presence || closed) return;
    send(frame({ topic: presenceTopic!, type: 'presence', data: await present(o.db, o.presence.gagId) }));
  };
  const close = async () => {
    if (closed) return;
    closed = true;
    if (timer) clearInterval(timer);
    off?.();
    try {
      controllerRef?.close();
    } catch {
      /* already closed by the client */
    }
    if (o.presence) {
      await leave(o.db, o.presence.tabId, o.userId, connId).catch(() => {});
      await publish({ topic: presenceTopic!, type: 'presence' });
    }
  };
  const check = async () => {
    if (closed) return false;
    if (await o.allowed().catch(() => false)) return true;
    send(frame({ topic: '*', type: 'gone' }));
    await close();
    return false;
  };
  const tick = async () => {
    try {
      if (!(await check())) return;
      send(': beat\n\n');
      // The hello again (e.g. the pass's seq): an event lost on the way is made good within one beat.
      for (const e of (await o.hello?.()) ?? []) send(frame(e));
      if (o.presence) {
        if (!(await touch(o.db, o.presence.tabId, o.userId, connId))) await beatIfAbsent(o.db, mark());
        await sendPresence();
      }
    } catch (err) {
      console.error('[live] heartbeat failed:', (err as Error).message);
    }
  };

  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      controllerRef = controller;
      o.req.signal?.addEventListener('abort', () => void close());
      // retry: how long the browser waits before it reconnects on its own.
      send('retry: 2000\n: open\n\n');
      const unsubscribe = await subscribe([...o.topics, `user:${o.userId}`], (e) => {
        if (e.topic === `user:${o.userId}`) void check();
        else if (e.type === 'presence' && e.topic === presenceTopic && e.data === undefined) void sendPresence().catch(() => {});
        else send(frame(e));
      });
      // The client may have gone while we waited (a tab closed as the page loaded): leave nothing behind.
      if (closed) return unsubscribe();
      off = unsubscribe;
      if (o.presence) {
        await beat(o.db, mark());
        if (closed) return void (await leave(o.db, o.presence.tabId, o.userId, connId).catch(() => {}));
        await publish({ topic: presenceTopic!, type: 'presence' });
      }
      for (const e of (await o.hello?.()) ?? []) send(frame(e));
      if (closed) return;
      timer = setInterval(() => void tick(), heartbeatMs());
    },
    cancel() {
      void close();
    },
  });
  return new Response(stream, { headers: STREAM_HEADERS });
}
