// PostgreSQL LISTEN/NOTIFY, the fan-out between app instances (lib/live/bus.ts).
// NOTIFY goes through the pool; each process holds one extra connection that
// LISTENs and reconnects on its own when it is lost.
import 'server-only';
import { type Kysely, sql } from 'kysely';
import pg from 'pg';

export const LIVE_CHANNEL = 'quadrille_live';
/** PostgreSQL refuses NOTIFY payloads of 8000 bytes or more. */
export const MAX_NOTIFY_BYTES = 7900;

export async function pgNotify(db: Kysely<any>, payload: string): Promise<void> {
  await sql`select pg_notify(${LIVE_CHANNEL}, ${payload})`.execute(db);
}

export type Listener = { close: () => Promise<void> };

/** How often the listening connection proves it is alive, and how long an answer may take. */
const PING_MS = 15_000;
const PING_TIMEOUT_MS = 5_000;

/**
 * Keeps one LISTEN connection open. `onUp` runs after every (re)connection:
 * notifications sent while it was down are lost, so subscribers must catch up.
 */
export function listen(url: string, onPayload: (payload: string) => void, onUp: (first: boolean) => void): Listener {
  let client: pg.Client | null = null;
  let closed = false;
  let attempt = 0;
  let first = true;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let pinger: ReturnType<typeof setInterval> | null = null;

  const retry = () => {
    if (closed) return;
    client = null;
    const wait = Math.min(5000, 100 * 2 ** Math.min(attempt++, 6));
    timer = setTimeout(connect, wait);
  };

  const connect = async () => {
    if (closed) return;
    // keepAlive: a connection a NAT or a failover silently dropped is noticed by TCP too.
    const c = new pg.Client({ connectionString: url, keepAlive: true });
    c.on('notification', (n) => {
      if (n.channel === LIVE_CHANNEL && n.payload) onPayload(n.payload);
    });
    c.on('error', () => {
      /* 'end' follows and reconnects */
    });
    c.on('end', () => {
      if (client === c) retry();
    });
    try {
      await c.connect();
      await c.query(`listen ${LIVE_CHANNEL}`);
      client = c;
      attempt = 0;
      onUp(first);
      first = false;
      // A half-open connection never ends by itself: ask it something now and then, and start over when it is silent.
      if (pinger) clearInterval(pinger);
      pinger = setInterval(() => {
        if (client !== c) return;
        // Reconnect at once (ending a dead socket may never finish) and let the old client go.
        const drop = () => {
          if (client === c) retry();
          void c.end().catch(() => {});
        };
        const silent = setTimeout(drop, PING_TIMEOUT_MS);
        c.query('select 1').then(
          () => clearTimeout(silent),
          () => {
            clearTimeout(silent);
            drop();
          },
        );
      }, PING_MS);
      pinger.unref?.();
    } catch (err) {
      console.error('[live] LISTEN connection failed:', (err as Error).message);
      c.end().catch(() => {});
      retry();
    }
  };
  void connect();

  return {
    close: async () => {
      closed = true;
      if (timer) clearTimeout(timer);
      if (pinger) clearInterval(pinger);
      const c = client;
      client = null;
      await c?.end().catch(() => {});
    },
  };
}
