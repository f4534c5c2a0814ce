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
  const kept = new WeakMap<Kysely<Database>, LRUCache<string, { version: string; value: T }>>();
  return async (db: Kysely<Database>, key: string): Promise<T> => {
    const version = dataVersion(db);
    if (version === null) return compute(db, key);
    let answers = kept.get(db);
    if (!answers) {
      answers = new LRUCache({ max: opts.max });
      kept.set(db, answers);
    }
    const hit = answers.get(key);
    if (hit && hit.version === version) return hit.value;
    const value = await compute(db, key);
    answers.set(key, { version, value });
    return value;
  };
}
