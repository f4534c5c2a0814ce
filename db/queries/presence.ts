// Who else is looking at a gag (its page or one of its passes), by heartbeat.
import type { Kysely } from 'kysely';
import type { Database } from '../database';

export const PRESENCE_WINDOW_MS = 20_000;

export async function beat(db: Kysely<Database>, scope: string, userId: string, now = new Date()) {
  await db
    .insertInto('presence')
    .values({ scope, userId, seenAt: now.toISOString() })
    .onConflict((oc) => oc.columns(['scope', 'userId']).doUpdateSet({ seenAt: now.toISOString() }))
    .execute();
}

export async function present(db: Kysely<Database>, scopePrefix: string, now = new Date()) {
  const since = new Date(now.getTime() - PRESENCE_WINDOW_MS).toISOString();
  return db
    .selectFrom('presence as p')
    .innerJoin('users as u', 'u.id', 'p.userId')
    .select(['u.id as userId', 'u.name', 'p.scope', 'p.seenAt'])
    .where('p.scope', 'like', `${scopePrefix}%`)
    .where('p.seenAt', '>=', since)
    .orderBy('u.name')
    .execute();
}
