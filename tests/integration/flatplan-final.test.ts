// The flatplan draws every page as the reader will see it: a page's current final page (a
// gag's, or a matter page's own) with what its placement needs, else the newest pass standing
// in (the client marks it "not final"), else nothing; it follows uploads, fits and going back,
// and the series' stream hears every change of final art so an open volume page redraws.
// Scans: greyscale at 100 ppi over 156 mm (the demo page's 150 mm trim + 2 × 3 mm bleed).
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import * as currentRoute from '@/app/api/final-pages/[finalPageId]/current/route';
import * as fitRoute from '@/app/api/final-pages/[finalPageId]/fit/route';
import * as imageRoute from '@/app/api/final-pages/[finalPageId]/image/[variant]/route';
import * as gagFinalRoute from '@/app/api/gags/[gagId]/final-pages/route';
import * as entryFinalRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/final-pages/route';
import * as flatplanRoute from '@/app/api/volumes/[volumeId]/flatplan/route';
import { createGag } from '@/db/queries/gags';
import { createPass } from '@/db/queries/passes';
import { addEntry, createVolume } from '@/db/queries/volumes';
import { type LiveEvent, subscribe } from '@/lib/live/bus';
import { callRoute, callRouteRaw } from '../support/call-route';
import { form, greyTiff, pxOf } from '../support/scans';
import { useS3AndDb } from '../support/s3-fake';
import { DEMO_SERIES_ID } from '../support/test-db';

const env = useS3AndDb();
const SCAN = { w: 156, h: 156, ppi: 100 };
const SIDE = pxOf(156, 100); // 614 px

async function newGag(title: string) {
  const id = randomUUID();
  await createGag(env.db(), { id, seriesId: DEMO_SERIES_ID, title, premise: '', status: 'inked' });
  return id;
}

type FlatPage = { number: number; entryId: string; gagId?: string; latestPass: { id: string; seq: number } | null; final: any };

async function flatplan(volumeId: string): Promise<FlatPage[]> {
  const r = await callRoute(flatplanRoute.GET, { as: 'viewer', params: { volumeId } });
  expect(r.status).toBe(200);
  return r.body.pages;
}

describe('the flatplan shows final pages, or the newest pass standing in', () => {
  it('final page where there is one (gag or matter page), the pass otherwise; it follows fits, replacements and going back', async () => {
    const db = env.db();
    const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Flatplan finals', deadline: '2027-03-13' });
    const cover = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'cover' });
    const inked = await newGag('Inked and scanned');
    const drawn = await newGag('Drawn, not scanned');
    const pass1 = await createPass(db, { gagId: drawn, userId: 'demo-user-owner' });
    const pass2 = await createPass(db, { gagId: drawn, userId: 'demo-user-owner' });
    await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: inked });
    await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: drawn });
    const title = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'title' });

    // Nothing uploaded yet: no page has a final page.
    expect((await flatplan(v.id)).map((p) => p.final)).toEqual([null, null, null, null]);

    // The series' stream hears every change of final art, a matter page's included.
    const heard: LiveEvent[] = [];
    const off = await subscribe([`series:${DEMO_SERIES_ID}`], (e) => heard.push(e));
    try {
      const coverUp = await callRoute(entryFinalRoute.POST, {
        method: 'POST',
        as: 'cocreator',
        params: { volumeId: v.id, entryId: cover.id },
        form: form(await greyTiff({ ...SCAN, tone: 200 }), 'cover.tif', 'image/tiff'),
      });
      expect(coverUp.status).toBe(201);
      const first = await callRoute(gagFinalRoute.POST, {
        method: 'POST',
        as: 'cocreator',
        params: { gagId: inked },
        form: form(await greyTiff({ ...SCAN, tone: 220 }), 'inked.tif', 'image/tiff'),
      });
      expect(first.status).toBe(201);
      await expect.poll(() => heard.filter((e) => e.type === 'final').map((e) => e.ids)).toEqual([[cover.id], [inked]]);

      let pages = await flatplan(v.id);
      expect(pages.map((p) => p.number)).toEqual([1, 2, 3, 4]);
      // The scan's size and fit are what the placement needs; the scan records 100 ppi over 156 mm, the bleed box, so it starts fitted to the bleed.
      expect(pages[0]).toMatchObject({ entryId: cover.id, latestPass: null });
      expect(pages[0]!.final).toEqual({
        id: coverUp.body.id,
        width: SIDE,
        height: SIDE,
        colour: 'grey',
        fit: { to: 'bleed', x: 0, y: 0, scale: 1, rotation: 0 },
        version: expect.stringMatching(/^[0-9a-f]{16}$/),
      });
      expect(pages[1]).toMatchObject({ gagId: inked, final: { id: first.body.id, width: SIDE, height: SIDE, colour: 'grey' } });
      // No final page: the newest pass stands in (its seq for the thumbnail's address).
      expect(pages[2]).toMatchObject({ gagId: drawn, final: null, latestPass: { id: pass2.id } });
      expect(pages[2]!.latestPass!.id).not.toBe(pass1.id);
      expect(pages[3]).toMatchObject({ entryId: title.id, final: null, latestPass: null });

      // The preview the flatplan draws is served to a viewer.
      const preview = await callRouteRaw(imageRoute.GET, { as: 'viewer', params: { finalPageId: first.body.id, variant: 'preview' } });
      expect(preview.status).toBe(200);
      expect(preview.headers.get('content-type')).toBe('image/webp');

      // A fit shows at once, and the stream hears it.
      const before = heard.length;
      const fit = { to: 'trim', x: 1.5, y: -2, scale: 1.1, rotation: 90 };
      expect((await callRoute(fitRoute.PUT, { method: 'PUT', as: 'owner', params: { finalPageId: first.body.id }, body: fit })).status).toBe(200);
      expect((await flatplan(v.id))[1]!.final.fit).toEqual(fit);
      await expect.poll(() => heard.slice(before).some((e) => e.type === 'final')).toBe(true);

      // A new scan replaces it, with another version; going back brings the first one back with its fit.
      const second = await callRoute(gagFinalRoute.POST, {
        method: 'POST',
        as: 'cocreator',
        params: { gagId: inked },
        form: form(await greyTiff({ ...SCAN, w: 150, h: 150, tone: 180 }), 'inked-2.tif', 'image/tiff'),
      });
      expect(second.status).toBe(201);
      pages = await flatplan(v.id);
      expect(pages[1]!.final).toMatchObject({ id: second.body.id, width: pxOf(150, 100), fit: { to: 'trim', x: 0, y: 0, scale: 1, rotation: 0 } });
      const secondVersion = pages[1]!.final.version;
      expect((await callRoute(currentRoute.POST, { method: 'POST', as: 'cocreator', params: { finalPageId: first.body.id } })).status).toBe(200);
      pages = await flatplan(v.id);
      expect(pages[1]!.final).toMatchObject({ id: first.body.id, fit });
      expect(pages[1]!.final.version).not.toBe(secondVersion);
      // The other pages did not move.
      expect(pages[0]!.final.id).toBe(coverUp.body.id);
      expect(pages[2]!.final).toBeNull();
    } finally {
      off();
    }
  });
});
