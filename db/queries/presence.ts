// Who else has a gag open (its page, the compare view or one of its passes), per
// tab: a live stream keeps its tab's row fresh and deletes it when the tab goes;
// without a stream, heartbeats do. Rows not seen for PRESENCE_WINDOW_MS are gone.
import type { Kysely } from 'kysely';
import type { Database } from '../database';

export const PRESENCE_WINDOW_MS = 20_000;

export type PresenceDto = { userId: string; name: string; where: string; panel: number | null; seenAt: string };

export async function beat(
  db: Kysely<Database>,
  p: { gagId: string; tabId: string; userId: string; where: string; panel?: number | null },
  now = new Date(),
) {
  const seenAt = now.toISOString();
  const panel = p.panel ?? null;
  await db
    .insertInto('presenceTabs')
    .values({ tabId: p.tabId, userId: p.userId, gagId: p.gagId, where: p.where, panel, seenAt })
    .onConflict((oc) => oc.columns(['tabId', 'userId']).doUpdateSet({ gagId: p.gagId, where: p.where, panel, seenAt }))
    .execute();
}

/** Refreshes a tab's row without changing where it is; false when the row is gone. */
export async function touch(db: Kysely<Database>, tabId: string, userId: string, now = new Date()): Promise<boolean> {
  const r = await db
    .updateTable('presenceTabs')
    .set({ seenAt: now.toISOString() })
    .where('tabId', '=', tabId)
    .where('userId', '=', userId)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) > 0;
}

export async function leave(db: Kysely<Database>, tabId: string, userId: string) {
  await db.deleteFrom('presenceTabs').where('tabId', '=', tabId).where('userId', '=', userId).execute();
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
