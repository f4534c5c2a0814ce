// A query built and compiled once per database handle, then run with each call's values as its
// parameters. Building a Kysely query (an immutable tree), passing it through the plugins and compiling
// it to SQL is work repeated on every request for the same SQL; on the hottest reads (the board) it
// cost more than SQLite's own time. Kysely's answer plugins (camel case) still run on every result.
import type { Compilable, CompiledQuery, Kysely } from 'kysely';
import type { Database } from './database';

const PLACEHOLDER = '\u0000kept-query-argument:';

type Kept<R> = { compiled: CompiledQuery<R>; slots: number[] };

/**
 * `build` is called once per handle with stand-ins for its arguments; each stand-in must reach the
 * SQL as a parameter (a value compared or inserted), not shape the query — a list whose length
 * changes the SQL, an identifier — and the first compile checks that every stand-in did.
 */
export function keptQuery<A extends (string | number)[], R>(build: (db: Kysely<Database>, ...args: A) => Compilable<R>) {
  const kept = new WeakMap<Kysely<Database>, Kept<R>>();
  const compile = (db: Kysely<Database>, arity: number): Kept<R> => {
    const stand = Array.from({ length: arity }, (_, i) => `${PLACEHOLDER}${i}`);
    const compiled = build(db, ...(stand as A)).compile();
    const slots = compiled.parameters.map((p) => (typeof p === 'string' && p.startsWith(PLACEHOLDER) ? Number(p.slice(PLACEHOLDER.length)) : -1));
    for (let i = 0; i < arity; i++) {
      if (!slots.includes(i)) throw new Error(`keptQuery: argument ${i} does not reach the SQL as a parameter`);
    }
    return { compiled, slots };
  };
  return async (db: Kysely<Database>, ...args: A): Promise<R[]> => {
    let k = kept.get(db);
    if (!k) {
      k = compile(db, args.length);
      kept.set(db, k);
    }
    const { compiled, slots } = k;
    const parameters = compiled.parameters.map((p, i) => (slots[i]! >= 0 ? args[slots[i]!] : p));
    const result = await db.executeQuery<R>({ ...compiled, parameters });
    return result.rows;
  };
}
