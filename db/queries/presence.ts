// Who else has a gag open (its page, the compare view or one of its passes), per
// tab: a live stream keeps its tab's row fresh and deletes it when the tab goes;
// without a stream, heartbeats do. Rows not seen for PRESENCE_WINDOW_MS are gone.
import type { Kysely } from 'kysely';
import type { Database } from '../database';

export const PRESENCE_WINDOW_MS = 20_000;

export type PresenceDto = { userId: string; name: string; where: string; panel: number | null; seenAt: string };

/**
 * I am here. A stream passes its connection id and owns the row from then on; a
 * heartbeat or a panel change without one updates the row but not its owner.
 */
export async function beat(
  db: Kysely<Database>,
  p: { gagId: string; tabId: string; userId: string; where: string; panel?: number | null; connId?: string },
  now = new Date(),
) {
  // A heartbeat that does not say the panel keeps the one last said.
  const row = { gagId: p.gagId, where: p.where, seenAt: now.toISOString(), ...(p.panel !== undefined ? { panel: p.panel } : {}) };
  await db
    .insertInto('presenceTabs')
    .values({ tabId: p.tabId, userId: p.userId, connId: p.connId ?? 'poll', panel: null, ...row })
    .onConflict((oc) => oc.columns(['tabId', 'userId']).doUpdateSet(p.connId ? { ...row, connId: p.connId } : row))
    .execute();
}

/** Refreshes the row this connection owns; false when it is gone (or a newer connection took it). */
export async function touch(db: Kysely<Database>, tabId: string, userId: string, connId: string, now = new Date()): Promise<boolean> {
  const r = await db
    .updateTable('presenceTabs')
    .set({ seenAt: now.toISOString() })
    .where('tabId', '=', tabId)
    .where('userId', '=', userId)
    .where('connId', '=', connId)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) > 0;
}

/** The tab went away: its row goes, unless a newer connection of the same tab has taken it over. */
export async function leave(db: Kysely<Database>, tabId: string, userId: string, connId: string) {
  await db.deleteFrom('presenceTabs').where('tabId', '=', tabId).where('userId', '=', userId).where('connId', '=', connId).execute();
}

export async function present(db: Kysely<Database>, gagId: string, now = new Date()): Promise<PresenceDto[]> {
  const since = new Date(now.getTime() - PRESENCE_WINDOW_MS).toISOString();
  return db
    .selectFrom('presenceTabs as p')
    .innerJoin('users as u', 'u.id', 'p.userId')
    .select(['u.id as userId', 'u.name', 'p.where', 'p.panel', 'p.seenAt'])
    .where('p.gagId', '=', gagId)
    .where('p.seenAt', '>=', since)
    .orderBy('u.name')
    .orderBy('p.where')
    .execute();
}

/** Puts the tab's row back after it expired, unless a newer connection of the tab holds it. */
export async function beatIfAbsent(
  db: Kysely<Database>,
  p: { gagId: string; tabId: string; userId: string; where: string; panel: number | null; connId: string },
  now = new Date(),
) {
  await db
    .insertInto('presenceTabs')
    .values({ tabId: p.tabId, userId: p.userId, connId: p.connId, gagId: p.gagId, where: p.where, panel: p.panel, seenAt: now.toISOString() })
    .onConflict((oc) => oc.columns(['tabId', 'userId']).doNothing())
    .execute();
}
