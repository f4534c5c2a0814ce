// Loads the demo scenario (demo-data.ts) with its sketches (demo-sketches.ts).
// Idempotent: fixed ids, and every insert ignores rows that already exist.
import type { Kysely } from 'kysely';
import { BEAT_KINDS } from '@/lib/gags/status';
import { hashPassword } from '@/lib/auth/password';
import type { Database } from '../database';
import { ROOMS, copyItems } from '../queries/pass-items';
import { recountPass } from '../queries/pass-size';
import { strokeRowValues } from '../queries/stroke-rows';
import { demoSketch } from './demo-sketches';
import {
  DEMO_COMMENTS,
  DEMO_GAGS,
  DEMO_PASSWORD,
  DEMO_SERIES_ID,
  DEMO_USERS,
  DEMO_VOLUME_ID,
  LOW_TIDE_ORDER,
  MEMBERSHIPS,
  OTHER_SERIES_ID,
  PASSES_BY_STATUS,
  STAMPED,
} from './demo-data';

import { generateKeyBetween } from 'fractional-indexing';
import { DEFAULT_VOLUME_SPEC } from '@/lib/print/book';
import { DEFAULT_HOURS } from '@/lib/planning/plan';

export async function seedDemo(db: Kysely<Database>): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const base = Date.parse('2026-11-02T09:00:00Z');
  const at = (hours: number) => new Date(base + hours * 3600_000).toISOString();
  await db.transaction().execute(async (trx) => {
    await trx
      .insertInto('users')
      .values(DEMO_USERS.map((u) => ({ ...u, passwordHash, createdAt: at(0) })))
      .onConflict((oc) => oc.doNothing())
      .execute();
    await trx
      .insertInto('series')
      .values([
        { id: DEMO_SERIES_ID, title: 'Kettle Crab', createdAt: at(0) },
        { id: OTHER_SERIES_ID, title: 'Lantern Moth', createdAt: at(1) },
      ])
      .onConflict((oc) => oc.doNothing())
      .execute();
    await trx
      .insertInto('memberships')
      .values(MEMBERSHIPS.map((m) => ({ ...m, createdAt: at(0) })))
      .onConflict((oc) => oc.doNothing())
      .execute();
    let i = 0;
    for (const g of DEMO_GAGS) {
      const passes = PASSES_BY_STATUS[g.status];
      i += 1;
      const created = at(24 * i);
      const changed = at(24 * i + 30 + ((i * 7) % 11) * 5);
      await trx
        .insertInto('gags')
        .values({
          id: g.id,
          seriesId: g.seriesId,
          title: g.title,
          premise: g.premise,
          status: g.status,
          position: i,
          createdBy: g.seriesId === DEMO_SERIES_ID ? 'demo-user-owner' : 'demo-user-outsider',
          createdAt: created,
          updatedAt: changed,
        })
        .onConflict((oc) => oc.doNothing())
        .execute();
      await trx
        .insertInto('beats')
        .values(BEAT_KINDS.map((kind) => ({ gagId: g.id, kind, note: g.notes[kind] ?? '', updatedAt: changed })))
        .onConflict((oc) => oc.doNothing())
        .execute();
      for (let n = 1; n <= passes; n++) {
        const passId = `${g.id}-pass-${n}`;
        const exists = await trx.selectFrom('passes').select('id').where('id', '=', passId).executeTakeFirst();
        if (exists) continue;
        const { strokes, rooms } = demoSketch(g.id, n);
        await trx
          .insertInto('passes')
          .values({
            id: passId,
            gagId: g.id,
            number: n,
            seq: 1,
            copiedFrom: null,
            createdBy: 'demo-user-owner',
            createdAt: changed,
            updatedAt: changed,
          })
          .execute();
        // Stored exactly as the pass log stores strokes and rooms.
        for (const st of strokes)
          await trx
            .insertInto('strokes')
            .values(strokeRowValues(passId, st, 1, 'demo-user-owner'))
            .execute();
        await recountPass(trx, passId);
        await copyItems(trx, ROOMS, rooms, passId, 1);
        await trx
          .insertInto('revisions')
          .values({ id: `${passId}-rev-1`, passId, seq: 1, reason: 'created', restoredFrom: null, userId: 'demo-user-owner', createdAt: changed })
          .execute();
        if (n === passes && STAMPED.includes(g.status)) {
          await trx
            .insertInto('stamps')
            .values({
              id: `${passId}-stamp`,
              passId,
              gagId: g.id,
              decision: 'ready',
              note: 'Reads without a word.',
              passSeq: 1,
              userId: 'demo-user-editor',
              createdAt: changed,
              clearedAt: null,
              clearedSeq: null,
            })
            .onConflict((oc) => oc.doNothing())
            .execute();
        }
      }
    }
    await trx
      .insertInto('volumes')
      .values({
        id: DEMO_VOLUME_ID,
        seriesId: DEMO_SERIES_ID,
        title: 'Low Tide',
        deadline: '2027-03-13',
        hoursPerWeek: 6,
        spec: JSON.stringify({ ...DEFAULT_VOLUME_SPEC, trimW: 150, trimH: 150, bleed: 3, binding: 'saddle' }),
        hoursPerPage: JSON.stringify(DEFAULT_HOURS),
        createdAt: at(0),
      })
      .onConflict((oc) => oc.doNothing())
      .execute();
    let key: string | null = null;
    for (const e of LOW_TIDE_ORDER) {
      key = generateKeyBetween(key, null);
      await trx
        .insertInto('volumeEntries')
        .values({ id: e.id, volumeId: DEMO_VOLUME_ID, kind: e.kind, gagId: e.gagId ?? null, position: key, createdAt: at(1) })
        .onConflict((oc) => oc.doNothing())
        .execute();
    }
    for (const c of DEMO_COMMENTS) {
      const passId = c.pass ? `${c.gagId}-pass-${c.pass}` : null;
      const target = c.parent ? 'panel' : c.beat ? 'beat' : c.panel !== undefined ? 'panel' : passId ? 'pass' : 'gag';
      const parent = c.parent ? DEMO_COMMENTS.find((p) => p.id === c.parent) : undefined;
      await trx
        .insertInto('comments')
        .values({
          id: c.id,
          gagId: c.gagId,
          parentId: c.parent ?? null,
          target,
          passId: parent ? `${parent.gagId}-pass-${parent.pass}` : passId,
          panel: parent?.panel ?? c.panel ?? null,
          beat: c.beat ?? null,
          x: null,
          y: null,
          body: c.body,
          authorId: c.by,
          createdAt: at(24 * 20 + DEMO_COMMENTS.indexOf(c)),
          editedAt: null,
          resolvedAt: c.resolved ? at(24 * 21) : null,
          resolvedBy: c.resolved ? 'demo-user-owner' : null,
        })
        .onConflict((oc) => oc.doNothing())
        .execute();
    }
  });
}

export async function isEmpty(db: Kysely<Database>): Promise<boolean> {
  const row = await db
    .selectFrom('users')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .executeTakeFirstOrThrow();
  return Number(row.n) === 0;
}
