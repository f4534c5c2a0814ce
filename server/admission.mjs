// @ts-check
// The front door's admission: requests that each cost the event loop a few ms inside Next.js (routing,
// the route's module, next-auth's form handling) and arrive by the hundred — sign-in forms above all —
// are let into Next.js a few at a time. The rest wait here, before Next.js has spent anything on them:
// a parked request costs the HTTP parse it already had. So a burst of 100 sign-ins does not hold up the
// health check or the board that arrived with it, which go straight in.
// This is about this process's own event loop, so it is per process on purpose; who may sign in, and how
// often, is still decided in the database (lib/auth/throttle.ts).

import { clientKey, trustedEntry } from '../lib/auth/client-key.mjs';

/** Runs `fn` on the event loop's next turn, so requests that came in meanwhile go first. */
const nextTurn = (fn) => setImmediate(fn);

/**
 * Waiting requests are kept per client (`keyOf`) and let in by turns, one client after another: a burst
 * from one address waits behind itself, and someone else's sign-in gets the next free place. Past
 * `waiting` in all, or `perClient` from one client, the answer is 503 at once.
 * A request is let in on a turn of the event loop of its own; its place is given back when its answer
 * has ended and the handler settled. A handler that fails gets a 500 (or its connection closed).
 * @param {{ concurrent: number, waiting: number, perClient?: number, retryAfterS?: number, what: string,
 *   keyOf?: (req: import('node:http').IncomingMessage) => string, bodyMs?: number }} opts
 */
export function admission(opts) {
  let active = 0;
  let waiting = 0;
  /** Each client's waiting requests, in the order the clients' turns come (a Map keeps insertion order). */
  /** @type {Map<string, Array<() => void>>} */
  const queues = new Map();
  const keyOf = opts.keyOf ?? ((req) => req.socket?.remoteAddress ?? 'unknown');
  const bodyMs = opts.bodyMs ?? 10_000;

  /** The next request to let in: the first client's oldest; that client, if it has more, goes to the back. */
  const takeNext = () => {
    const first = queues.entries().next();
    if (first.done) return undefined;
    const [key, queue] = first.value;
    const start = queue.shift();
    queues.delete(key);
    if (queue.length > 0) queues.set(key, queue);
    waiting--;
    return start;
  };

  const pump = () => {
    while (active < opts.concurrent && waiting > 0) {
      const start = /** @type {() => void} */ (takeNext());
      active++;
      nextTurn(start);
    }
  };

  /**
   * @param {import('node:http').IncomingMessage} req
   * @param {import('node:http').ServerResponse} res
   * @param {number} status
   * @param {string} message
   * @param {Record<string, string>} [headers]
   */
  const answer = (req, res, status, message, headers = {}) => {
    if (res.headersSent || res.destroyed) {
      req.destroy();
      return;
    }
    const body = JSON.stringify({ error: message });
    res.writeHead(status, {
      'content-type': 'application/json',
      'content-length': String(Buffer.byteLength(body)),
      'cache-control': 'no-store',
      ...headers,
    });
    res.end(body);
  };

  return {
    /**
     * Hands `req` to `handle` now or when a place frees up; past `waiting` answers 503 with Retry-After.
     * @param {import('node:http').IncomingMessage} req
     * @param {import('node:http').ServerResponse} res
     * @param {(req: import('node:http').IncomingMessage, res: import('node:http').ServerResponse) => unknown} handle
     */
    admit(req, res, handle) {
      const key = keyOf(req);
      const queue = queues.get(key) ?? [];
      if (waiting >= opts.waiting || queue.length >= (opts.perClient ?? opts.waiting)) {
        answer(req, res, 503, `Too many ${opts.what} at once on this server. Try again in a few seconds.`, {
          'retry-after': String(opts.retryAfterS ?? 2),
        });
        return;
      }
      const start = () => {
        res.off('close', leftWhileWaiting);
        const release = () => {
          active--;
          pump();
        };
        if (res.destroyed || res.writableEnded) {
          release();
          return;
        }
        // A form is a few hundred bytes, all there on arrival; one whose body is withheld loses its place.
        const deadline = req.complete
          ? undefined
          : setTimeout(() => {
              if (req.complete) return;
              answer(req, res, 408, 'The form did not arrive in time.', { connection: 'close' });
              // The rest of the body is not waited for: the connection goes, and the handler reading it settles.
              if (res.writableFinished) req.destroy();
              else res.once('finish', () => req.destroy());
            }, bodyMs);
        const closed = new Promise((resolve) => res.once('close', resolve));
        const handled = Promise.resolve()
          .then(() => handle(req, res))
          .catch((err) => {
            console.error(`[admission] ${req.method} ${req.url}:`, err);
            answer(req, res, 500, 'The server could not handle this request.');
          });
        // The place is given back once the answer has ended (or its client has gone) and the handler has
        // settled: a client that hangs up does not free a place Next.js is still working in.
        void Promise.all([closed, handled]).then(() => {
          clearTimeout(deadline);
          release();
        });
      };
      // A client that gives up while waiting takes its turn with it.
      const leftWhileWaiting = () => {
        const at = queue.indexOf(start);
        if (at < 0) return;
        queue.splice(at, 1);
        waiting--;
        if (queue.length === 0 && queues.get(key) === queue) queues.delete(key);
      };
      res.once('close', leftWhileWaiting);
      queues.set(key, queue);
      waiting++;
      queue.push(start);
      pump();
    },
    get active() {
      return active;
    },
    get pending() {
      return waiting;
    },
  };
}

/**
 * The requests that check or set a password: next-auth's forms (sign-in, sign-out), signing up, and
 * changing one's password.
 * @param {Pick<import('node:http').IncomingMessage, 'method' | 'url'>} req
 */
export function isCredentialForm(req) {
  let path = (req.url ?? '').split('?')[0] ?? '';
  // Next.js also matches a route by its decoded path: /api/%75sers is /api/users.
  try {
    path = decodeURIComponent(path);
  } catch {
    /* not decodable: matched as sent */
  }
  if (req.method === 'POST') return path.startsWith('/api/auth/') || path === '/api/users';
  return req.method === 'PATCH' && path === '/api/me';
}

/**
 * Whose turn a request waits in: the socket's address, or with `trustedHops` proxies in front (TRUST_PROXY)
 * the X-Forwarded-For entry the outermost of them wrote — keyed as the per-client sign-in limit keys it
 * (lib/auth/client-key.mjs: IPv6 by its /64).
 * @param {Pick<import('node:http').IncomingMessage, 'headers' | 'socket'>} req
 * @param {number} trustedHops
 */
export function clientOf(req, trustedHops) {
  const raw = req.headers['x-forwarded-for'];
  const entry = trustedHops > 0 ? trustedEntry(Array.isArray(raw) ? raw.join(',') : raw, trustedHops) : null;
  return clientKey(entry ?? req.socket?.remoteAddress ?? 'unknown');
}
