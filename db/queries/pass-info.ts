// A pass with the gag it belongs to: what stamping, restoring and the
// series guard need to know about it. Its own module, as both the pass log
// and the stamps use it and the pass log calls into the stamps.
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '../database';
import { keptQuery } from '../kept-query';

const passAndGag = keptQuery((db, passId: string) =>
  db
    .selectFrom('passes as p')
    .innerJoin('gags as g', 'g.id', 'p.gagId')
    .select(['p.id', 'p.number', 'p.seq', 'p.gagId', 'g.status', 'g.seriesId', 'g.title'])
    .where('p.id', '=', passId),
);

export async function passWithGag(db: Kysely<Database> | Transaction<Database>, passId: string) {
  const [row] = await passAndGag(db, passId);
  return row;
}
