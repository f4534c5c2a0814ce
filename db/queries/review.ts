// Checklist items (per series) and ticks (per pass), and findings inputs.
import { randomUUID } from 'node:crypto';
import type { Kysely } from 'kysely';
import { DEFAULT_CHECKLIST } from '@/lib/review/checklist';
import type { Database } from '../database';

export type ChecklistItemDto = { id: string; text: string; ticked: boolean; by: string | null; at: string | null };

/** The series' items; a series that never had any gets the defaults. */
export async function checklistItems(db: Kysely<Database>, seriesId: string) {
  const any = await db.selectFrom('checklistItems').select('id').where('seriesId', '=', seriesId).limit(1).executeTakeFirst();
  if (!any) {
    const now = new Date().toISOString();
    await db
      .insertInto('checklistItems')
      .values(DEFAULT_CHECKLIST.map((text, i) => ({ id: randomUUID(), seriesId, text, position: i + 1, createdAt: now, removedAt: null })))
      .execute();
  }
  return db
    .selectFrom('checklistItems')
    .select(['id', 'text', 'position'])
    .where('seriesId', '=', seriesId)
    .where('removedAt', 'is', null)
    .orderBy('position')
    .execute();
}

export async function passChecklist(db: Kysely<Database>, seriesId: string, passId: string): Promise<ChecklistItemDto[]> {
  const items = await checklistItems(db, seriesId);
  const ticks = await db
    .selectFrom('checklistTicks as t')
    .leftJoin('users as u', 'u.id', 't.userId')
    .select(['t.itemId', 't.tickedAt', 'u.name'])
    .where('t.passId', '=', passId)
    .execute();
  const byItem = new Map(ticks.map((t) => [t.itemId, t]));
  return items.map((i) => {
    const t = byItem.get(i.id);
    return { id: i.id, text: i.text, ticked: !!t, by: t?.name ?? null, at: t?.tickedAt ?? null };
  });
}

/** Sets exactly these items ticked; existing ticks keep who and when. Unknown ids are refused. */
export async function setTicks(db: Kysely<Database>, seriesId: string, passId: string, userId: string, ticked: string[]): Promise<string | null> {
  const items = await checklistItems(db, seriesId);
  const known = new Set(items.map((i) => i.id));
  const unknown = ticked.find((id) => !known.has(id));
  if (unknown) return `"${unknown}" is not an item of this series' checklist.`;
  const want = new Set(ticked);
  await db.transaction().execute(async (trx) => {
    const have = await trx.selectFrom('checklistTicks').select('itemId').where('passId', '=', passId).execute();
    const haveSet = new Set(have.map((h) => h.itemId));
    const drop = [...haveSet].filter((id) => !want.has(id));
    if (drop.length) await trx.deleteFrom('checklistTicks').where('passId', '=', passId).where('itemId', 'in', drop).execute();
    const add = [...want].filter((id) => !haveSet.has(id));
    const now = new Date().toISOString();
    if (add.length)
      await trx
        .insertInto('checklistTicks')
        .values(add.map((itemId) => ({ passId, itemId, userId, tickedAt: now })))
        .execute();
  });
  return null;
}

/** Replaces the series' list: listed ids are reworded and reordered, new ones added, missing ones retired. */
export async function setChecklistItems(db: Kysely<Database>, seriesId: string, items: { id?: string; text: string }[]) {
  await checklistItems(db, seriesId);
  await db.transaction().execute(async (trx) => {
    const now = new Date().toISOString();
    const current = await trx.selectFrom('checklistItems').select('id').where('seriesId', '=', seriesId).where('removedAt', 'is', null).execute();
    const keep = new Set(items.map((i) => i.id).filter(Boolean));
    for (const c of current) if (!keep.has(c.id)) await trx.updateTable('checklistItems').set({ removedAt: now }).where('id', '=', c.id).execute();
    for (const [i, item] of items.entries()) {
      if (item.id && current.some((c) => c.id === item.id)) {
        await trx
          .updateTable('checklistItems')
          .set({ text: item.text, position: i + 1 })
          .where('id', '=', item.id)
          .execute();
      } else {
        await trx
          .insertInto('checklistItems')
          .values({ id: randomUUID(), seriesId, text: item.text, position: i + 1, createdAt: now, removedAt: null })
          .execute();
      }
    }
  });
  return checklistItems(db, seriesId);
}

export async function inkThresholdOf(db: Kysely<Database>, seriesId: string): Promise<number> {
  const row = await db.selectFrom('series').select('inkThreshold').where('id', '=', seriesId).executeTakeFirst();
  return row?.inkThreshold ?? 0.35;
}
