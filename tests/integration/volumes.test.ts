import { beforeAll, describe, expect, it } from 'vitest';
import * as volumesRoute from '@/app/api/series/[seriesId]/volumes/route';
import * as entryRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/route';
import * as positionRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/position/route';
import * as entriesRoute from '@/app/api/volumes/[volumeId]/entries/route';
import * as flatplanRoute from '@/app/api/volumes/[volumeId]/flatplan/route';
import * as planRoute from '@/app/api/volumes/[volumeId]/plan/route';
import * as volumeRoute from '@/app/api/volumes/[volumeId]/route';
import { DEMO_VOLUME_ID } from '@/db/seed/demo-data';
import { callRoute } from '../support/call-route';
import { DEMO_SERIES_ID, freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  db = await freshDb();
});

const order = async (volumeId: string) =>
  (await callRoute(volumeRoute.GET, { as: 'viewer', params: { volumeId } })).body.entries.map((e: { id: string }) => e.id);

describe('volumes', () => {
  it('the demo volume "Low Tide": 150 mm square, 3 mm bleed, saddle stitched, due 2027-03-13', async () => {
    const r = await callRoute(volumesRoute.GET, { as: 'editor', params: { seriesId: DEMO_SERIES_ID } });
    expect(r.body[0]).toMatchObject({
      title: 'Low Tide',
      deadline: '2027-03-13',
      spec: { trimW: 150, trimH: 150, bleed: 3, binding: 'saddle', direction: 'ltr' },
    });
  });

  it('owners create volumes and change the print spec; others may not', async () => {
    const c = await callRoute(volumesRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID },
      body: { title: 'High Water', deadline: '2027-09-01', spec: { trimW: 148, trimH: 210 } },
    });
    expect(c.status).toBe(201);
    expect(c.body.spec).toMatchObject({ trimW: 148, trimH: 210, bleed: 3 });
    expect(
      (
        await callRoute(volumeRoute.PATCH, {
          method: 'PATCH',
          as: 'cocreator',
          params: { volumeId: c.body.id },
          body: { spec: { binding: 'perfect' } },
        })
      ).status,
    ).toBe(403);
    const p = await callRoute(volumeRoute.PATCH, {
      method: 'PATCH',
      as: 'owner',
      params: { volumeId: c.body.id },
      body: { spec: { binding: 'perfect', bleed: 3.175 } },
    });
    expect(p.body.spec).toMatchObject({ binding: 'perfect', bleed: 3.175, trimW: 148 });
    expect(
      (await callRoute(volumeRoute.PATCH, { method: 'PATCH', as: 'owner', params: { volumeId: c.body.id }, body: { deadline: '13/03/2027' } }))
        .status,
    ).toBe(422);
    expect(
      (
        await callRoute(volumeRoute.PATCH, {
          method: 'PATCH',
          as: 'owner',
          params: { volumeId: c.body.id },
          body: { spec: { safe: 60, gutter: 40 } },
        })
      ).status,
    ).toBe(422);
  });
});

describe('running order', () => {
  it('places a gag once; matter pages of their own kinds', async () => {
    const add = (body: unknown) => callRoute(entriesRoute.POST, { method: 'POST', as: 'cocreator', params: { volumeId: DEMO_VOLUME_ID }, body });
    const g = await add({ gagId: 'demo-gag-07' });
    expect(g.status).toBe(201);
    expect(g.body).toMatchObject({ kind: 'gag', gagId: 'demo-gag-07', title: 'Sugar Cube' });
    expect((await add({ gagId: 'demo-gag-07' })).status).toBe(409);
    expect((await add({ gagId: 'demo-gag-21' })).status).toBe(422); // another series' gag
    expect((await add({ kind: 'blank' })).body.kind).toBe('blank');
    expect((await add({ kind: 'poster' })).status).toBe(422);
    expect(
      (await callRoute(entriesRoute.POST, { method: 'POST', as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, body: { kind: 'blank' } })).status,
    ).toBe(403);
  });

  it('moving an entry rewrites one row, and the order follows', async () => {
    const before = await order(DEMO_VOLUME_ID);
    const snapshot = async () => db.selectFrom('volumeEntries').select(['id', 'position']).where('volumeId', '=', DEMO_VOLUME_ID).execute();
    const rows0 = await snapshot();
    const moved = before[5];
    const r = await callRoute(positionRoute.PUT, {
      method: 'PUT',
      as: 'cocreator',
      params: { volumeId: DEMO_VOLUME_ID, entryId: moved },
      body: { after: before[1] },
    });
    expect(r.status).toBe(200);
    const rows1 = await snapshot();
    const changed = rows1.filter((x) => rows0.find((y) => y.id === x.id)!.position !== x.position);
    expect(changed.map((c) => c.id)).toEqual([moved]);
    const after = await order(DEMO_VOLUME_ID);
    expect(after).toEqual([before[0], before[1], moved, ...before.slice(2).filter((id: string) => id !== moved)]);
    // before: to the very front
    await callRoute(positionRoute.PUT, {
      method: 'PUT',
      as: 'owner',
      params: { volumeId: DEMO_VOLUME_ID, entryId: moved },
      body: { before: after[0] },
    });
    expect((await order(DEMO_VOLUME_ID))[0]).toBe(moved);
    expect(
      (await callRoute(positionRoute.PUT, { method: 'PUT', as: 'owner', params: { volumeId: DEMO_VOLUME_ID, entryId: moved }, body: {} })).status,
    ).toBe(422);
  });

  it('removing an entry frees its gag', async () => {
    const entries = (await callRoute(volumeRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } })).body.entries;
    const sugar = entries.find((e: { gagId: string }) => e.gagId === 'demo-gag-07');
    expect(
      (await callRoute(entryRoute.DELETE, { method: 'DELETE', as: 'cocreator', params: { volumeId: DEMO_VOLUME_ID, entryId: sugar.id } })).status,
    ).toBe(204);
    expect(
      (await callRoute(entriesRoute.POST, { method: 'POST', as: 'cocreator', params: { volumeId: DEMO_VOLUME_ID }, body: { gagId: 'demo-gag-07' } }))
        .status,
    ).toBe(201);
  });
});

describe('flatplan and plan', () => {
  it('warns about a page count the binding cannot take and gags not ready', async () => {
    const f = await callRoute(flatplanRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    const n = f.body.pages.length;
    expect(n).toBe(11); // 9 demo pages + Sugar Cube + a blank
    expect(f.body.pageCountValid).toBe(false);
    expect(f.body.blanksNeeded).toBe(1);
    expect(f.body.spreads[0]).toEqual([null, 1]);
    expect(f.body.spineMm).toBeNull(); // saddle stitched: no spine
    expect(f.body.notReady.map((g: { title: string }) => g.title)).toEqual(['Sugar Cube']);
    expect(f.body.printerSpreads).toEqual([]);
  });
  it('the plan counts hours left against the deadline', async () => {
    const p = await callRoute(planRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    expect(p.status).toBe(200);
    // Sugar Cube (in review): 2.25 h; two ready to ink: 2 × 1.75 h; one inked: 0.25 h → 6 h; and the cover, the
    // title page and the afterword, pages still to make: 3 × (0.5 + 1.5 + 0.25) = 6.75 h → 12.75 h.
    expect(p.body.hoursLeft).toBeCloseTo(12.75, 10);
    expect(p.body.deadline).toBe('2027-03-13');
    expect(typeof p.body.finish).toBe('string');
  });
});

describe('matter pages in the plan', () => {
  it('a matter page marked done stops counting; marked to make again, it counts again; a gag page cannot be marked', async () => {
    const hours = async () => (await callRoute(planRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } })).body.hoursLeft as number;
    const mark = (entryId: string, done: unknown, as: 'cocreator' | 'viewer' = 'cocreator') =>
      callRoute(entryRoute.PATCH, { method: 'PATCH', as, params: { volumeId: DEMO_VOLUME_ID, entryId }, body: { done } });
    const before = await hours();
    const r = await mark('demo-entry-cover', true);
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ id: 'demo-entry-cover', done: true });
    // The cover's three stages, 0.5 + 1.5 + 0.25 h, are no longer counted.
    expect(await hours()).toBeCloseTo(before - 2.25, 10);
    const entries = (await callRoute(volumeRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } })).body.entries;
    expect(entries.find((e: { id: string }) => e.id === 'demo-entry-cover').done).toBe(true);
    expect(entries.find((e: { id: string }) => e.id === 'demo-entry-title').done).toBe(false);
    expect((await mark('demo-entry-cover', false)).status).toBe(200);
    expect(await hours()).toBeCloseTo(before, 10);
    const gagPage = await mark('demo-entry-01', true);
    expect(gagPage.status).toBe(422);
    expect(gagPage.body.error).toMatch(/status/);
    expect((await mark('demo-entry-title', 'yes')).status).toBe(422);
    expect((await mark('demo-entry-title', true, 'viewer')).status).toBe(403);
    expect((await mark('no-such-entry', true)).status).toBe(404);
    expect(await hours()).toBeCloseTo(before, 10);
  });
});

describe('a placed gag takes its volume’s page', () => {
  it('thumbnails and bleed checks follow the volume spec, not the series default', async () => {
    const { pageSpecForGag } = await import('@/db/queries/series');
    const { createVolume, addEntry } = await import('@/db/queries/volumes');
    const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'A5 book', deadline: '2027-05-01', spec: { trimW: 148, trimH: 210 } });
    expect((await pageSpecForGag(db, DEMO_SERIES_ID, 'demo-gag-10')).trimH).toBe(150);
    await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: 'demo-gag-10' });
    expect(await pageSpecForGag(db, DEMO_SERIES_ID, 'demo-gag-10')).toEqual({ trimW: 148, trimH: 210, bleed: 3, safe: 5, gutter: 4 });
  });
});
