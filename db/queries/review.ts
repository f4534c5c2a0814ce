// Checklist items (per series) and ticks (per pass), and findings inputs.
import { randomUUID } from 'node:crypto';
import type { Kysely } from 'kysely';
import { DEFAULT_CHECKLIST } from '@/lib/review/checklist';
import type { Database } from '../database';
import { Refused } from '@/lib/refused';

export type ChecklistItemDto = {
  id: string;
  text: string;
  ticked: boolean;
  by: string | null;
  at: string | null;
  /** Ticked on an earlier pass and carried here to be checked again; cleared when ticked on this pass. */
  recheck: { fromPass: number; carriedBy: string | null; at: string } | null;
};

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
  const rechecks = await db
    .selectFrom('checklistRechecks as r')
    .innerJoin('passes as p', 'p.id', 'r.fromPassId')
    .leftJoin('users as u', 'u.id', 'r.carriedBy')
    .select(['r.itemId', 'r.carriedAt', 'p.number', 'u.name'])
    .where('r.passId', '=', passId)
    .execute();
  const byItem = new Map(ticks.map((t) => [t.itemId, t]));
  const recheckOf = new Map(rechecks.map((r) => [r.itemId, r]));
  return items.map((i) => {
    const t = byItem.get(i.id);
    const r = t ? undefined : recheckOf.get(i.id);
    return {
      id: i.id,
      text: i.text,
      ticked: !!t,
      by: t?.name ?? null,
      at: t?.tickedAt ?? null,
      recheck: r ? { fromPass: r.number, carriedBy: r.name ?? null, at: r.carriedAt } : null,
    };
  });
}

/**
 * Sets exactly these items ticked; existing ticks keep who and when, and a tick clears the item's
 * "to re-check" mark. With `recheck`, exactly those items keep their mark (each must have one).
 * Unknown ids are refused (the message says which).
 */
export async function setTicks(
  db: Kysely<Database>,
  seriesId: string,
  passId: string,
  userId: string,
  ticked: string[],
  recheck?: string[],
): Promise<string | null> {
  const items = await checklistItems(db, seriesId);
  const known = new Set(items.map((i) => i.id));
  const unknown = [...ticked, ...(recheck ?? [])].find((id) => !known.has(id));
  if (unknown) return `"${unknown}" is not an item of this series' checklist.`;
  const want = new Set(ticked);
  return db.transaction().execute(async (trx) => {
    if (recheck) {
      const marked = new Set(
        (await trx.selectFrom('checklistRechecks').select('itemId').where('passId', '=', passId).execute()).map((r) => r.itemId),
      );
      const unmarked = recheck.find((id) => !marked.has(id));
      if (unmarked) return `"${unmarked}" is not marked "to re-check" on this pass.`;
      const drop = [...marked].filter((id) => !recheck.includes(id));
      if (drop.length) await trx.deleteFrom('checklistRechecks').where('passId', '=', passId).where('itemId', 'in', drop).execute();
    }
    const have = await trx.selectFrom('checklistTicks').select('itemId').where('passId', '=', passId).execute();
    const haveSet = new Set(have.map((h) => h.itemId));
    const drop = [...haveSet].filter((id) => !want.has(id));
    if (drop.length) await trx.deleteFrom('checklistTicks').where('passId', '=', passId).where('itemId', 'in', drop).execute();
    const add = [...want].filter((id) => !haveSet.has(id));
    const now = new Date().toISOString();
    if (add.length) {
      await trx
        .insertInto('checklistTicks')
        .values(add.map((itemId) => ({ passId, itemId, userId, tickedAt: now })))
        // Two people ticking the same item at once: the first tick stands.
        .onConflict((oc) => oc.columns(['passId', 'itemId']).doNothing())
        .execute();
      await trx.deleteFrom('checklistRechecks').where('passId', '=', passId).where('itemId', 'in', add).execute();
    }
    return null;
  });
}

/**
 * Carries the ticks of an earlier pass of the same gag to this one as "to re-check": every item
 * ticked there that is neither ticked nor already marked here. `from` is that pass's number; by
 * default the pass just before this one. Returns how many items were carried.
 */
export async function carryTicks(
  db: Kysely<Database>,
  seriesId: string,
  passId: string,
  userId: string,
  from?: number,
): Promise<{ carried: number; fromPass: number }> {
  const live = new Set((await checklistItems(db, seriesId)).map((i) => i.id));
  return db.transaction().execute(async (trx) => {
    const pass = await trx.selectFrom('passes').select(['gagId', 'number']).where('id', '=', passId).executeTakeFirstOrThrow();
    if (from === pass.number) throw new Refused(422, 'Carry ticks from another pass, not from this one.');
    let q = trx.selectFrom('passes').select(['id', 'number']).where('gagId', '=', pass.gagId);
    q = from === undefined ? q.where('number', '<', pass.number).orderBy('number', 'desc').limit(1) : q.where('number', '=', from);
    const source = await q.executeTakeFirst();
    if (!source) {
      throw new Refused(
        from === undefined ? 409 : 422,
        from === undefined ? `Pass ${pass.number} is the first pass: there are no earlier ticks to carry.` : `This gag has no pass ${from}.`,
      );
    }
    const theirs = (await trx.selectFrom('checklistTicks').select('itemId').where('passId', '=', source.id).execute())
      .map((t) => t.itemId)
      .filter((id) => live.has(id));
    if (theirs.length === 0) throw new Refused(409, `Pass ${source.number} has no ticks to carry.`);
    const ticked = new Set((await trx.selectFrom('checklistTicks').select('itemId').where('passId', '=', passId).execute()).map((t) => t.itemId));
    const carry = theirs.filter((id) => !ticked.has(id));
    if (carry.length) {
      const now = new Date().toISOString();
      const r = await trx
        .insertInto('checklistRechecks')
        .values(carry.map((itemId) => ({ passId, itemId, fromPassId: source.id, carriedBy: userId, carriedAt: now })))
        // Already marked (by an earlier carry, or two at once): the first mark stands.
        .onConflict((oc) => oc.columns(['passId', 'itemId']).doNothing())
        .executeTakeFirst();
      return { carried: Number(r.numInsertedOrUpdatedRows ?? 0), fromPass: source.number };
    }
    return { carried: 0, fromPass: source.number };
  });
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
