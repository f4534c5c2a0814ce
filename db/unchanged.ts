// Answers kept while the database is unchanged: a read whose answer depends only on what is stored is
// computed once and given again for as long as nothing at all has been committed to the database since
// (db/dialect.ts `dataVersion`: on SQLite, this connection's count of changed rows and SQLite's
// `data_version` for every other connection). Any commit, by any process, in any table, makes the next
// ask compute afresh, so a kept answer is never older than the database; how long one lasts depends on how
// quiet the database is. On PostgreSQL there is no such reading, and every ask computes.
import type { Kysely } from 'kysely';
import { LRUCache } from 'lru-cache';
import type { Database } from './database';
import { dataVersion } from './dialect';

/**
 * `compute(db, key)` kept per database handle and key (at most `max` keys), with the version read before
 * computing: a commit that lands while it runs leaves the kept answer labelled older, so the next ask
 * computes again rather than trusting it.
 */
export function whileUnchanged<T>(compute: (db: Kysely<Database>, key: string) => Promise<T>, opts: { max: number }) {
  type Kept = { answers: LRUCache<string, { version: string; value: T }>; running: Map<string, Promise<T>> };
  const kept = new WeakMap<Kysely<Database>, Kept>();
  return async (db: Kysely<Database>, key: string): Promise<T> => {
    const version = dataVersion(db);
    if (version === null) return compute(db, key);
    let mine = kept.get(db);
    if (!mine) {
      mine = { answers: new LRUCache({ max: opts.max }), running: new Map() };
      kept.set(db, mine);
    }
    const { answers, running } = mine;
    const hit = answers.get(key);
    if (hit && hit.version === version) return hit.value;
    // Asks that arrive together, at one version, share one computation.
    const id = `${version} ${key}`;
    const already = running.get(id);
    if (already) return already;
    const computing = compute(db, key).finally(() => running.delete(id));
    running.set(id, computing);
    const value = await computing;
    // (One computed at an older version may replace a newer one: that costs the next ask a computation, no more.)
    answers.set(key, { version, value });
    return value;
  };
}
