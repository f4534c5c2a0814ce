import { beforeAll, describe, expect, it } from 'vitest';
import * as passesRoute from '@/app/api/gags/[gagId]/passes/route';
import * as checklistRoute from '@/app/api/passes/[passId]/checklist/route';
import * as carryRoute from '@/app/api/passes/[passId]/checklist/carry/route';
import * as findingsRoute from '@/app/api/passes/[passId]/findings/route';
import * as opsRoute from '@/app/api/passes/[passId]/ops/route';
import * as itemsRoute from '@/app/api/series/[seriesId]/checklist/route';
import { DEFAULT_CHECKLIST } from '@/lib/review/checklist';
import { callRoute } from '../support/call-route';
import { DEMO_SERIES_ID, freshDb } from '../support/test-db';

let passId = '';
beforeAll(async () => {
  await freshDb();
  const p = await callRoute(passesRoute.POST, { method: 'POST', as: 'owner', params: { gagId: 'demo-gag-09' }, body: {} });
  passId = p.body.id;
});

describe('silent-read checklist', () => {
  it('starts with the default items, none ticked', async () => {
    const r = await callRoute(checklistRoute.GET, { as: 'viewer', params: { passId } });
    expect(r.body.map((i: { text: string }) => i.text)).toEqual([...DEFAULT_CHECKLIST]);
    expect(r.body.every((i: { ticked: boolean }) => !i.ticked)).toBe(true);
  });

  it('an editor ticks items; each tick says who and when; a viewer cannot', async () => {
    const items = (await callRoute(checklistRoute.GET, { as: 'editor', params: { passId } })).body;
    const r = await callRoute(checklistRoute.PUT, { method: 'PUT', as: 'editor', params: { passId }, body: { ticked: [items[0].id, items[2].id] } });
    expect(r.status).toBe(200);
    expect(r.body.filter((i: { ticked: boolean }) => i.ticked).map((i: { by: string }) => i.by)).toEqual(['Ivo Sand', 'Ivo Sand']);
    expect(r.body[0].at).toMatch(/^\d{4}-/);
    const v = await callRoute(checklistRoute.PUT, { method: 'PUT', as: 'viewer', params: { passId }, body: { ticked: [] } });
    expect(v.status).toBe(403);
    const bad = await callRoute(checklistRoute.PUT, { method: 'PUT', as: 'owner', params: { passId }, body: { ticked: ['nope'] } });
    expect(bad.status).toBe(422);
    // Unticking one keeps the other's who and when.
    const again = await callRoute(checklistRoute.PUT, { method: 'PUT', as: 'owner', params: { passId }, body: { ticked: [items[2].id] } });
    expect(again.body[2]).toMatchObject({ ticked: true, by: 'Ivo Sand' });
    expect(again.body[0].ticked).toBe(false);
  });

  it('the owner rewords, adds and removes items for the series', async () => {
    const items = (await callRoute(itemsRoute.GET, { as: 'owner', params: { seriesId: DEMO_SERIES_ID } })).body;
    const next = [{ id: items[1].id, text: 'The surprise shows in panel 3.' }, { text: 'Kettle is always recognisable.' }];
    const r = await callRoute(itemsRoute.PUT, { method: 'PUT', as: 'owner', params: { seriesId: DEMO_SERIES_ID }, body: { items: next } });
    expect(r.status).toBe(200);
    expect(r.body.map((i: { text: string }) => i.text)).toEqual(['The surprise shows in panel 3.', 'Kettle is always recognisable.']);
    expect(
      (await callRoute(itemsRoute.PUT, { method: 'PUT', as: 'cocreator', params: { seriesId: DEMO_SERIES_ID }, body: { items: next } })).status,
    ).toBe(403);
    const onPass = (await callRoute(checklistRoute.GET, { as: 'viewer', params: { passId } })).body;
    expect(onPass).toHaveLength(2);
  });
});

describe('ticks carried to the next pass as "to re-check"', () => {
  type Item = { id: string; text: string; ticked: boolean; recheck: { fromPass: number; carriedBy: string } | null };
  const carry = (as: 'viewer' | 'editor' | 'owner', pass: string, body: Record<string, unknown> = {}) =>
    callRoute(carryRoute.POST, { method: 'POST', as, params: { passId: pass }, body });
  const put = (pass: string, body: Record<string, unknown>) =>
    callRoute(checklistRoute.PUT, { method: 'PUT', as: 'editor', params: { passId: pass }, body });

  it('marks the earlier pass’s ticks on the new pass; ticking one clears its mark; the rest can be dropped', async () => {
    await callRoute(itemsRoute.PUT, {
      method: 'PUT',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID },
      body: { items: [{ text: 'Reads left to right.' }, { text: 'The turn is a surprise.' }, { text: 'Kettle is always recognisable.' }] },
    });
    const first: Item[] = (await callRoute(checklistRoute.GET, { as: 'editor', params: { passId } })).body;
    await put(passId, { ticked: [first[0]!.id, first[2]!.id] });
    const next = await callRoute(passesRoute.POST, { method: 'POST', as: 'owner', params: { gagId: 'demo-gag-09' }, body: {} });
    const fresh: Item[] = (await callRoute(checklistRoute.GET, { as: 'viewer', params: { passId: next.body.id } })).body;
    // A new pass starts empty: nothing ticked, nothing marked.
    expect(fresh.map((i) => [i.ticked, i.recheck])).toEqual([
      [false, null],
      [false, null],
      [false, null],
    ]);
    const from = (await callRoute(passesRoute.GET, { as: 'viewer', params: { gagId: 'demo-gag-09' } })).body.find(
      (p: { id: string }) => p.id === passId,
    ).number;

    const r = await carry('editor', next.body.id);
    expect(r.status).toBe(200);
    const carried: Item[] = r.body;
    expect(carried.map((i) => (i.recheck ? `${i.recheck.fromPass} ${i.recheck.carriedBy}` : null))).toEqual([
      `${from} Ivo Sand`,
      null,
      `${from} Ivo Sand`,
    ]);
    expect(carried.every((i) => !i.ticked)).toBe(true);

    // Ticking an item on this pass is the re-check: its mark goes, the other stays.
    const ticked: Item[] = (await put(next.body.id, { ticked: [carried[0]!.id] })).body;
    expect(ticked.map((i) => [i.ticked, !!i.recheck])).toEqual([
      [true, false],
      [false, false],
      [false, true],
    ]);
    // Carrying again changes nothing: a ticked item is not marked, a marked one stays marked once.
    expect((await carry('editor', next.body.id)).body).toEqual(ticked);
    // Keeping no marks drops them; the ticks stay.
    const dropped: Item[] = (await put(next.body.id, { ticked: [carried[0]!.id], recheck: [] })).body;
    expect(dropped.map((i) => [i.ticked, !!i.recheck])).toEqual([
      [true, false],
      [false, false],
      [false, false],
    ]);
    // Only a marked item can keep a mark.
    const bad = await put(next.body.id, { ticked: [], recheck: [carried[1]!.id] });
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatch(/not marked "to re-check"/);
  });

  it('refuses what cannot be carried, and viewers', async () => {
    const passes = (await callRoute(passesRoute.GET, { as: 'viewer', params: { gagId: 'demo-gag-09' } })).body as { id: string; number: number }[];
    const firstPass = passes.reduce((a, b) => (a.number < b.number ? a : b));
    const last = passes.reduce((a, b) => (a.number > b.number ? a : b));
    const before = (await callRoute(checklistRoute.GET, { as: 'viewer', params: { passId: last.id } })).body;
    const first = await carry('editor', firstPass.id);
    expect(first.status).toBe(409);
    expect(first.body.error).toMatch(/first pass/);
    expect((await carry('editor', last.id, { from: 99 })).status).toBe(422);
    expect((await carry('editor', last.id, { from: last.number })).status).toBe(422);
    expect((await carry('editor', last.id, { from: 'one' })).status).toBe(422);
    expect((await carry('viewer', last.id)).status).toBe(403);
    // A pass before it with no ticks has nothing to carry.
    await callRoute(passesRoute.POST, { method: 'POST', as: 'owner', params: { gagId: 'demo-gag-09' }, body: {} });
    const after = await callRoute(passesRoute.POST, { method: 'POST', as: 'owner', params: { gagId: 'demo-gag-09' }, body: {} });
    const none = await carry('owner', after.body.id);
    expect(none.status).toBe(409);
    expect(none.body.error).toMatch(/no ticks to carry/);
    expect((await callRoute(checklistRoute.GET, { as: 'viewer', params: { passId: last.id } })).body).toEqual(before);
  });
});

describe('findings', () => {
  it('per panel: ink load, room intrusions, marks past the safe area, empty; beats without notes', async () => {
    const heavy = Array.from({ length: 20 }, (_, i) => ({
      id: `h${i}`,
      panel: 1,
      tool: 'tone',
      grey: 60,
      size: 4,
      points: [
        [78, 6 + i * 3.3, 0.5],
        [144, 6 + i * 3.3, 0.5],
      ],
    }));
    const intruder = {
      id: 'in-room',
      panel: 0,
      tool: 'pen',
      grey: 100,
      size: 0.6,
      points: [
        [12, 12, 0.5],
        [20, 12, 0.5],
      ],
    };
    const past = {
      id: 'past',
      panel: 2,
      tool: 'pen',
      grey: 100,
      size: 0.6,
      points: [
        [2, 100, 0.5],
        [30, 100, 0.5],
      ],
    };
    const room = { id: 'r1', panel: 0, shape: 'rect', x: 8, y: 8, w: 25, h: 10 };
    const ops = [...heavy, intruder, past].map((stroke) => ({ op: 'add', stroke }));
    expect(
      (
        await callRoute(opsRoute.POST, {
          method: 'POST',
          as: 'owner',
          params: { passId },
          body: { batchId: 'f1', ops: [...ops, { op: 'room', room }] },
        })
      ).status,
    ).toBe(200);
    const r = await callRoute(findingsRoute.GET, { as: 'viewer', params: { passId } });
    expect(r.status).toBe(200);
    const [p0, p1, p2, p3] = r.body.panels;
    expect(p1.inkLoad).toBeGreaterThan(0.35);
    expect(p1.inkHeavy).toBe(true);
    expect(p0).toMatchObject({ roomIntrusions: 1, roomIntrusionIds: ['in-room'], empty: false, inkHeavy: false });
    expect(p2).toMatchObject({ outsideSafe: 1, outsideSafeIds: ['past'] });
    expect(p3).toMatchObject({ empty: true, inkLoad: 0 });
    // Tea Party's demo notes leave "turn" and "payoff" empty.
    expect(r.body.beatsMissing).toEqual(['turn', 'payoff']);
  });
});
