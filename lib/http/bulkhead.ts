// A bulkhead for a route whose requests are many and cost the server's one event loop
// something each (a burst of 100 sign-ins is ~1 s of it): only a few are handled at a time,
// the rest wait as parked promises that cost nothing, so a light request arriving in the
// middle of the burst waits for a few of them, not for all. Past `waiting` the answer is
// 503 with Retry-After at once. This is about this process's own event loop, so it is
// per process on purpose; what is decided (who may sign in) stays in the database.
import pLimit from 'p-limit';
import { Refused } from '@/lib/refused';

/**
 * Waits for the event loop's next turn. A waiting request is started when another one ends, and with
 * SQLite (synchronous under its promises) a whole refusal runs in microtasks: started from there, the
 * queue would drain in one go — 70 refusals at once — while a health check that arrived meanwhile waits
 * for all of them. Started on a turn of its own, each one lets the requests that came in go first.
 */
const turn = () => new Promise<void>((resolve) => setImmediate(resolve));

export type Bulkhead = { run<T>(fn: () => Promise<T>): Promise<T>; readonly active: number; readonly pending: number };

export function bulkhead(opts: { concurrent: number; waiting: number; retryAfterS?: number; what: string }): Bulkhead {
  const limit = pLimit(opts.concurrent);
  return {
    run(fn) {
      if (limit.pendingCount >= opts.waiting) {
        return Promise.reject(
          new Refused(503, `Too many ${opts.what} at once on this server. Try again in a few seconds.`, undefined, {
            'Retry-After': String(opts.retryAfterS ?? 2),
          }),
        );
      }
      return limit(async () => {
        await turn();
        return fn();
      });
    },
    get active() {
      return limit.activeCount;
    },
    get pending() {
      return limit.pendingCount;
    },
  };
}
