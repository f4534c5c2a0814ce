// The heavy work runs in worker threads and is remembered by seq; a pass has a
// documented size limit that a batch cannot pass.
import { beforeAll, describe, expect, it } from 'vitest';
import * as passesRoute from '@/app/api/gags/[gagId]/passes/route';
import * as opsRoute from '@/app/api/passes/[passId]/ops/route';
import * as findingsRoute from '@/app/api/passes/[passId]/findings/route';
import * as thumbRoute from '@/app/api/passes/[passId]/thumbnail.svg/route';
import { recountPass } from '@/db/queries/pass-size';
import { strokeRowValues } from '@/db/queries/stroke-rows';
import { MAX_PASS_POINTS, MAX_POINTS_PER_STROKE, type Point, type Stroke } from '@/lib/strokes/types';
import { heavyTasksCompleted } from '@/lib/workers/pool';
import { callRoute } from '../support/call-route';
import { countRows, freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  db = await freshDb();
});

function stroke(id: string, n = 20, panel = 0): Stroke {
  const points: Point[] = Array.from({ length: n }, (_, i) => [10 + (i % 100) * 0.4, 10 + Math.floor(i / 100) * 0.05, 0.5]);
  return { id, panel, tool: 'pen', grey: 100, size: 0.8, points };
}

async function newPass(gagId: string) {
  const r = await callRoute(passesRoute.POST, { method: 'POST', as: 'cocreator', params: { gagId }, body: {} });
  expect(r.status).toBe(201);
  return r.body as { id: string; number: number };
}

const send = (passId: string, batchId: string, ops: unknown[]) =>
  callRoute(opsRoute.POST, { method: 'POST', as: 'cocreator', params: { passId }, body: { batchId, ops } });

describe('heavy work off the request thread', () => {
  it('a thumbnail is drawn once per seq, in the worker pool, and drawn again after a change', async () => {
    const p = await newPass('demo-gag-09');
    await send(p.id, 'h-1', [
      { op: 'add', stroke: stroke('h1') },
      { op: 'add', stroke: stroke('h2', 30, 2) },
    ]);
    const before = heavyTasksCompleted();
    const [a, b] = await Promise.all([
      callRoute(thumbRoute.GET, { as: 'viewer', params: { passId: p.id } }),
      callRoute(thumbRoute.GET, { as: 'viewer', params: { passId: p.id } }),
    ]);
    const c = await callRoute(thumbRoute.GET, { as: 'editor', params: { passId: p.id } });
    expect(a.body.match(/<path /g)).toHaveLength(2);
    expect(b.body).toBe(a.body);
    expect(c.body).toBe(a.body);
    expect(heavyTasksCompleted() - before).toBe(1);

    await send(p.id, 'h-2', [{ op: 'remove', strokeId: 'h1' }]);
    const d = await callRoute(thumbRoute.GET, { as: 'viewer', params: { passId: p.id } });
    expect(d.body.match(/<path /g)).toHaveLength(1);
    expect(heavyTasksCompleted() - before).toBe(2);
  });

  it('findings are computed in the pool and remembered until the pass changes', async () => {
    const p = await newPass('demo-gag-08');
    await send(p.id, 'f-1', [{ op: 'add', stroke: stroke('f1') }]);
    const before = heavyTasksCompleted();
    const a = await callRoute(findingsRoute.GET, { as: 'viewer', params: { passId: p.id } });
    const b = await callRoute(findingsRoute.GET, { as: 'viewer', params: { passId: p.id } });
    expect(a.status).toBe(200);
    expect(a.body.panels).toHaveLength(4);
    expect(b.body).toEqual(a.body);
    expect(heavyTasksCompleted() - before).toBe(1);
  });
});

describe('the size limit of a pass', () => {
  it(`a batch that would pass ${MAX_PASS_POINTS.toLocaleString('en')} points is refused whole with the reason; erasing makes room`, async () => {
    const p = await newPass('demo-gag-07');
    // Fill the pass to the limit directly (as the log would have stored it), without 300 requests.
    const full = MAX_PASS_POINTS / MAX_POINTS_PER_STROKE;
    const rows = Array.from({ length: full }, (_, i) => strokeRowValues(p.id, stroke(`big-${i}`, MAX_POINTS_PER_STROKE, i % 4), 1, null));
    for (let i = 0; i < rows.length; i += 50)
      await db
        .insertInto('strokes')
        .values(rows.slice(i, i + 50))
        .execute();
    await db.updateTable('passes').set({ seq: 1 }).where('id', '=', p.id).execute();
    await recountPass(db, p.id);

    const counts = await countRows(db, ['strokes', 'passBatches', 'strokeTombstones']);
    const r = await send(p.id, 'over-1', [
      { op: 'add', stroke: stroke('one-more', 2) },
      { op: 'add', stroke: stroke('and-another', 2) },
    ]);
    expect(r.status).toBe(422);
    expect(r.body.error).toMatch(/at most 50,000 strokes and 3,000,000 points; this one is full/);
    expect(await countRows(db, ['strokes', 'passBatches', 'strokeTombstones'])).toEqual(counts);

    // Erasing one stroke in the same batch makes room for the new one.
    const ok = await send(p.id, 'over-2', [
      { op: 'remove', strokeId: 'big-0' },
      { op: 'add', stroke: stroke('fits-now', 2) },
    ]);
    expect(ok.status).toBe(200);
  });

  it('the size kept on the pass row agrees with its rows after adds, removals, replays, copies and restores', async () => {
    const p = await newPass('demo-gag-06');
    const sizeOf = async (passId: string) => {
      const kept = await db.selectFrom('passes').select(['liveStrokes', 'livePoints']).where('id', '=', passId).executeTakeFirstOrThrow();
      const rows = await db.selectFrom('strokes').select('pointCount').where('passId', '=', passId).where('removedSeq', 'is', null).execute();
      expect({ strokes: kept.liveStrokes, points: kept.livePoints }).toEqual({
        strokes: rows.length,
        points: rows.reduce((n, r) => n + r.pointCount, 0),
      });
      return rows.length;
    };
    await send(p.id, 'z-1', [
      { op: 'add', stroke: stroke('z1', 12) },
      { op: 'add', stroke: stroke('z2', 30) },
      { op: 'add', stroke: stroke('z3', 7) },
    ]);
    await send(p.id, 'z-1', [{ op: 'add', stroke: stroke('z4', 5) }]); // a replayed batch id changes nothing
    await send(p.id, 'z-2', [
      { op: 'remove', strokeId: 'z2' },
      { op: 'remove', strokeId: 'z2' },
      { op: 'remove', strokeId: 'never-there' },
    ]);
    await send(p.id, 'z-3', [{ op: 'add', stroke: stroke('z2', 30) }]); // a removed id stays removed
    expect(await sizeOf(p.id)).toBe(2);
    const copy = await callRoute(passesRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { gagId: 'demo-gag-06' },
      body: { copyFrom: p.number },
    });
    expect(await sizeOf(copy.body.id)).toBe(2);
    const revs = await db.selectFrom('revisions').select(['id', 'seq']).where('passId', '=', p.id).orderBy('seq').execute();
    const { restoreRevision } = await import('@/db/queries/revisions');
    await restoreRevision(db, { passId: p.id, revisionId: revs[0]!.id, userId: 'demo-user-owner' });
    expect(await sizeOf(p.id)).toBe(0);
  });
});
