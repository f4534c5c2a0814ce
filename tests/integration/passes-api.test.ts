import { beforeAll, describe, expect, it } from 'vitest';
import * as passesRoute from '@/app/api/gags/[gagId]/passes/route';
import * as opsRoute from '@/app/api/passes/[passId]/ops/route';
import * as restoreRoute from '@/app/api/passes/[passId]/revisions/[revisionId]/restore/route';
import * as revisionsRoute from '@/app/api/passes/[passId]/revisions/route';
import * as passRoute from '@/app/api/passes/[passId]/route';
import * as thumbRoute from '@/app/api/passes/[passId]/thumbnail.svg/route';
import * as specRoute from '@/app/api/series/[seriesId]/print-spec/route';
import { storedPointBytes } from '@/db/queries/passes';
import { applyBatch } from '@/db/queries/batches';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import type { Point, Stroke } from '@/lib/strokes/types';
import { callRoute } from '../support/call-route';
import { DEMO_SERIES_ID, type Persona, countRows, freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  db = await freshDb();
});

function stroke(id: string, panel = 0, x0 = 10, y0 = 10, n = 20): Stroke {
  const points: Point[] = Array.from({ length: n }, (_, i) => [x0 + i * 0.5, y0 + Math.sin(i / 3) * 2, 0.5]);
  return { id, panel, tool: 'pen', grey: 100, size: 0.8, points };
}

async function newPass(gagId = 'demo-gag-09', body: unknown = {}) {
  const r = await callRoute(passesRoute.POST, { method: 'POST', as: 'cocreator', params: { gagId }, body });
  expect(r.status).toBe(201);
  return r.body as { id: string; number: number };
}

async function send(passId: string, batchId: string, ops: unknown[], as: Persona = 'cocreator') {
  return callRoute(opsRoute.POST, { method: 'POST', as, params: { passId }, body: { batchId, ops } });
}

async function state(passId: string) {
  const r = await callRoute(passRoute.GET, { as: 'viewer', params: { passId } });
  expect(r.status).toBe(200);
  return r.body as { seq: number; strokes: Stroke[]; rooms: unknown[] };
}

const ids = (s: { strokes: Stroke[] }) => s.strokes.map((x) => x.id).sort();

const rowCounts = () => countRows(db, ['strokes', 'passBatches', 'strokeMoves', 'strokeTombstones', 'rooms', 'revisions']);

describe('passes', () => {
  it('numbers passes 1, 2, 3… and lists them', async () => {
    const a = await newPass('demo-gag-11');
    const b = await newPass('demo-gag-11');
    expect([a.number, b.number]).toEqual([1, 2]);
    const list = await callRoute(passesRoute.GET, { as: 'editor', params: { gagId: 'demo-gag-11' } });
    expect(list.body.map((p: { number: number }) => p.number)).toEqual([1, 2]);
  });

  it('a new pass can start as a copy of an earlier one', async () => {
    const p1 = await newPass('demo-gag-12');
    await send(p1.id, 'copy-src', [
      { op: 'add', stroke: stroke('s1') },
      { op: 'add', stroke: stroke('s2', 3, 90, 100) },
    ]);
    const p2 = await newPass('demo-gag-12', { copyFrom: 1 });
    expect(p2.number).toBe(2);
    expect(ids(await state(p2.id))).toEqual(['s1', 's2']);
    const missing = await callRoute(passesRoute.POST, { method: 'POST', as: 'owner', params: { gagId: 'demo-gag-12' }, body: { copyFrom: 9 } });
    expect(missing.status).toBe(422);
  });
});

describe('operations', () => {
  it('stores strokes in mm within the quantum and acknowledges with the new seq', async () => {
    const p = await newPass();
    const s = stroke('a1', 1, 80.123, 20.456);
    const r = await send(p.id, 'b-1', [
      { op: 'add', stroke: s },
      { op: 'add', stroke: stroke('a2') },
    ]);
    expect(r).toEqual({ status: 200, body: { seq: 1 } });
    const st = await state(p.id);
    expect(st.seq).toBe(1);
    const back = st.strokes.find((x) => x.id === 'a1')!;
    expect(back.panel).toBe(1);
    back.points.forEach(([x, y], i) => {
      expect(Math.abs(x - s.points[i]![0])).toBeLessThanOrEqual(0.005 + 1e-9);
      expect(Math.abs(y - s.points[i]![1])).toBeLessThanOrEqual(0.005 + 1e-9);
    });
  });

  it('a batch sent twice changes nothing the second time and gets the same answer', async () => {
    const p = await newPass();
    const ops = [{ op: 'add', stroke: stroke('r1') }];
    const first = await send(p.id, 'same-batch', ops);
    const before = await rowCounts();
    const again = await send(p.id, 'same-batch', ops);
    expect(again).toEqual(first);
    // Even a different body under the same id is answered from the log.
    const other = await send(p.id, 'same-batch', [{ op: 'add', stroke: stroke('r2') }]);
    expect(other).toEqual(first);
    expect(await rowCounts()).toEqual(before);
    expect(ids(await state(p.id))).toEqual(['r1']);
  });

  it('interleaved batches from two people end in the union of their strokes', async () => {
    const p = await newPass();
    const order: [Persona, string, Stroke][] = [
      ['owner', 'o-1', stroke('o1', 0)],
      ['cocreator', 'c-1', stroke('c1', 1, 80)],
      ['owner', 'o-2', stroke('o2', 2, 10, 90)],
      ['cocreator', 'c-2', stroke('c2', 3, 80, 90)],
    ];
    const seqs = [];
    for (const [who, batch, s] of order) seqs.push((await send(p.id, batch, [{ op: 'add', stroke: s }], who)).body.seq);
    expect(seqs).toEqual([1, 2, 3, 4]);
    expect(ids(await state(p.id))).toEqual(['c1', 'c2', 'o1', 'o2']);
  });

  it('a removal beats an add of the same id, whatever the order', async () => {
    const p = await newPass();
    await send(p.id, 'rm-first', [{ op: 'remove', strokeId: 'late' }]);
    await send(p.id, 'add-after', [{ op: 'add', stroke: stroke('late') }]);
    await send(p.id, 'add-y', [{ op: 'add', stroke: stroke('y') }]);
    await send(p.id, 'rm-y', [{ op: 'remove', strokeId: 'y' }]);
    await send(p.id, 'add-y-again', [{ op: 'add', stroke: stroke('y') }]);
    expect(ids(await state(p.id))).toEqual([]);
  });

  it('moves shift strokes; the delta since a seq carries only what changed', async () => {
    const p = await newPass();
    await send(p.id, 'm-1', [
      { op: 'add', stroke: stroke('m1') },
      { op: 'add', stroke: stroke('m2') },
      { op: 'add', stroke: stroke('m3') },
    ]);
    await send(p.id, 'm-2', [
      { op: 'move', strokeIds: ['m1', 'ghost'], dx: 5, dy: -2 },
      { op: 'remove', strokeId: 'm2' },
    ]);
    const st = await state(p.id);
    expect(st.strokes.find((s) => s.id === 'm1')!.points[0]).toEqual([15, 8, expect.closeTo(0.5, 2)]);
    const d = await callRoute(passRoute.GET, { as: 'editor', params: { passId: p.id }, url: `/api/passes/${p.id}?since=1` });
    expect(d.body.seq).toBe(2);
    expect(d.body.strokes.map((s: Stroke) => s.id)).toEqual(['m1']);
    expect(d.body.removedStrokes).toEqual(['m2']);
    const none = await callRoute(passRoute.GET, { as: 'editor', params: { passId: p.id }, url: `/api/passes/${p.id}?since=2` });
    expect(none.body).toMatchObject({ strokes: [], removedStrokes: [], rooms: [], removedRooms: [] });
    const bad = await callRoute(passRoute.GET, { as: 'editor', params: { passId: p.id }, url: `/api/passes/${p.id}?since=-1` });
    expect(bad.status).toBe(422);
  });

  it('balloon rooms: add, update, remove', async () => {
    const p = await newPass();
    const room = { id: 'room1', panel: 0, shape: 'ellipse', x: 8, y: 8, w: 30, h: 14 };
    await send(p.id, 'room-1', [{ op: 'room', room }]);
    await send(p.id, 'room-2', [{ op: 'room', room: { ...room, w: 40 } }]);
    expect((await state(p.id)).rooms).toEqual([{ ...room, w: 40 }]);
    await send(p.id, 'room-3', [{ op: 'unroom', roomId: 'room1' }]);
    await send(p.id, 'room-4', [{ op: 'room', room }]);
    expect((await state(p.id)).rooms).toEqual([]);
  });

  it('adding a stroke writes the same number of rows at 0 or 500 strokes', async () => {
    const small = await newPass();
    const big = await newPass();
    const many = Array.from({ length: 500 }, (_, i) => ({
      op: 'add',
      stroke: stroke(`bulk${i}`, i % 4, 10 + (i % 4 === 1 || i % 4 === 3 ? 70 : 0), 10),
    }));
    expect((await send(big.id, 'bulk', many)).status).toBe(200);
    const measure = async (passId: string, batchId: string) => {
      const before = await rowCounts();
      await send(passId, batchId, [{ op: 'add', stroke: stroke(`one-${batchId}`) }]);
      const after = await rowCounts();
      return Object.fromEntries(Object.entries(after).map(([k, v]) => [k, v - before[k as keyof typeof before]]));
    };
    const a = await measure(small.id, 'one-small');
    const b = await measure(big.id, 'one-big');
    expect(a).toEqual(b);
    expect(a).toMatchObject({ strokes: 1, passBatches: 1 });
  });

  it('stores points in at most a third of the bytes of plain JSON', async () => {
    const p = await newPass();
    const strokes = Array.from({ length: 40 }, (_, i) => stroke(`j${i}`, 0, 10, 10 + i, 60));
    await send(
      p.id,
      'json-size',
      strokes.map((s) => ({ op: 'add', stroke: s })),
    );
    const json = JSON.stringify((await state(p.id)).strokes.map((s) => s.points)).length;
    expect((await storedPointBytes(db, p.id)) * 3).toBeLessThanOrEqual(json);
  });
});

describe('thumbnails', () => {
  it('an SVG page with one clipped path per live stroke', async () => {
    const p = await newPass();
    await send(p.id, 't-1', [
      { op: 'add', stroke: stroke('t1', 0) },
      { op: 'add', stroke: stroke('t2', 3, 90, 100) },
      { op: 'add', stroke: stroke('t3', 1, 80) },
    ]);
    await send(p.id, 't-2', [{ op: 'remove', strokeId: 't3' }]);
    const r = await callRoute(thumbRoute.GET, { as: 'viewer', params: { passId: p.id } });
    expect(r.status).toBe(200);
    expect(r.body).toMatch(/^<svg /);
    expect(r.body.match(/<path /g)).toHaveLength(2);
    expect(r.body).toContain('clip-path="url(#p-c3)"');
  });
});

describe('bad batches: 422 with the reason, and nothing stored', () => {
  const huge = stroke('huge', 0, 10, 10, 10_001);
  huge.points = huge.points.map(([, y, pr], i) => [10 + (i % 100) * 0.1, y, pr]);
  const cases: [string, unknown[], RegExp][] = [
    ['a point outside the bleed box', [{ op: 'add', stroke: stroke('out', 0, 155, 10, 2) }], /outside the bleed box/],
    ['a non-number', [{ op: 'add', stroke: { ...stroke('nan'), points: [[10, 'ten', 0.5]] } }], /numbers/],
    ['more than 10,000 points', [{ op: 'add', stroke: huge }], /10,000 points/],
    ['an unknown panel', [{ op: 'add', stroke: stroke('p4', 4) }], /Panels are numbered 0 to 3/],
    [
      'a move out of the page',
      [
        { op: 'add', stroke: stroke('ok1') },
        { op: 'move', strokeIds: ['ok1'], dx: 200, dy: 0 },
      ],
      /outside the bleed box/,
    ],
    ['an unknown op', [{ op: 'paint', x: 1 }], /./],
  ];
  it.each(cases)('%s', async (_name, ops, reason) => {
    const p = await newPass();
    await send(p.id, 'pre', [{ op: 'add', stroke: stroke('keep') }]);
    const before = await rowCounts();
    const r = await send(p.id, 'bad', ops);
    expect(r.status).toBe(422);
    expect(r.body.error).toMatch(reason);
    expect(await rowCounts()).toEqual(before);
    expect((await state(p.id)).seq).toBe(1);
  });

  it('a batch over 1 MB is 413', async () => {
    const p = await newPass();
    const ops = Array.from({ length: 9 }, (_, i) => ({ op: 'add', stroke: stroke(`big${i}`, 0, 10, 10, 9000) }));
    const raw = JSON.stringify({ batchId: 'too-big', ops });
    expect(raw.length).toBeGreaterThan(1_000_000);
    const r = await callRoute(opsRoute.POST, { method: 'POST', as: 'owner', params: { passId: p.id }, rawBody: raw });
    // 413 Content Too Large (RFC 9110 §15.5.14): the body, not its content, is what is wrong.
    expect(r.status).toBe(413);
    expect(r.body.error).toMatch(/1,000,000 bytes/);
    expect((await state(p.id)).strokes).toEqual([]);
  });
});

describe('revisions', () => {
  it('a pause leaves a revision; restore, then restore back; nothing is deleted', async () => {
    const p = await newPass();
    const t0 = Date.now();
    const spec = DEFAULT_PAGE_SPEC;
    const apply = (batchId: string, ops: Parameters<typeof applyBatch>[1]['ops'], at: number) =>
      applyBatch(db, { passId: p.id, batchId, ops, userId: 'demo-user-cocreator', spec, now: new Date(at) });
    await apply(
      'v1',
      [
        { op: 'add', stroke: stroke('v1') },
        { op: 'add', stroke: stroke('v2', 1, 80) },
      ],
      t0,
    );
    // A minute later, drawing resumes: the state at seq 1 becomes a revision.
    await apply(
      'v2',
      [
        { op: 'remove', strokeId: 'v1' },
        { op: 'add', stroke: stroke('v3', 2, 10, 90) },
        { op: 'move', strokeIds: ['v2'], dx: 3, dy: 3 },
      ],
      t0 + 60_000,
    );
    const revs = await callRoute(revisionsRoute.GET, { as: 'viewer', params: { passId: p.id } });
    expect(revs.status).toBe(200);
    const pause = revs.body.find((r: { reason: string }) => r.reason === 'pause');
    expect(pause.seq).toBe(1);

    const later = await state(p.id);
    expect(ids(later)).toEqual(['v2', 'v3']);

    const refused = await callRoute(restoreRoute.POST, { method: 'POST', as: 'editor', params: { passId: p.id, revisionId: pause.id } });
    expect(refused.status).toBe(403);

    const restored = await callRoute(restoreRoute.POST, { method: 'POST', as: 'cocreator', params: { passId: p.id, revisionId: pause.id } });
    expect(restored.status).toBe(200);
    const atPause = await state(p.id);
    expect(ids(atPause)).toEqual(['v1', 'v2']);
    expect(atPause.strokes.find((s) => s.id === 'v2')!.points[0]![0]).toBeCloseTo(80, 2);

    // The restore is recorded; the state before it is a revision too, so it can be undone.
    const revs2 = (await callRoute(revisionsRoute.GET, { as: 'viewer', params: { passId: p.id } })).body;
    expect(revs2[0]).toMatchObject({ reason: 'restore', restoredFrom: pause.id });
    const before = revs2.find((r: { reason: string; seq: number }) => r.seq === later.seq);
    expect(before).toBeDefined();
    await callRoute(restoreRoute.POST, { method: 'POST', as: 'owner', params: { passId: p.id, revisionId: before.id } });
    const back = await state(p.id);
    expect(ids(back)).toEqual(['v2', 'v3']);
    expect(back.strokes.find((s) => s.id === 'v2')!.points[0]![0]).toBeCloseTo(83, 2);

    const rows = await db.selectFrom('strokes').select('strokeId').where('passId', '=', p.id).execute();
    expect(rows.length).toBeGreaterThanOrEqual(4); // v1, v2, v3 and the re-added v1: history kept
  });

  it('an unknown revision is 404', async () => {
    const p = await newPass();
    const r = await callRoute(restoreRoute.POST, { method: 'POST', as: 'owner', params: { passId: p.id, revisionId: 'nope' } });
    expect(r.status).toBe(404);
  });
});

describe('page spec', () => {
  it('defaults, and the owner may change it within sense', async () => {
    const get = await callRoute(specRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } });
    expect(get.body).toEqual(DEFAULT_PAGE_SPEC);
    const bad = await callRoute(specRoute.PUT, {
      method: 'PUT',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID },
      body: { ...DEFAULT_PAGE_SPEC, safe: 74 },
    });
    expect(bad.status).toBe(422);
    const put = await callRoute(specRoute.PUT, {
      method: 'PUT',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID },
      body: { ...DEFAULT_PAGE_SPEC, gutter: 6 },
    });
    expect(put.status).toBe(200);
    expect((await callRoute(specRoute.GET, { as: 'editor', params: { seriesId: DEMO_SERIES_ID } })).body.gutter).toBe(6);
    await callRoute(specRoute.PUT, { method: 'PUT', as: 'owner', params: { seriesId: DEMO_SERIES_ID }, body: DEFAULT_PAGE_SPEC });
  });
});
