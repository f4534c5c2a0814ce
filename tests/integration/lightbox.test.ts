// The lightbox as a pass operation, against the running S3 fake: placed,
// changed, restored and copied like any other operation; refused for another
// series' upload; a used upload asks before it is deleted; and the review PDF
// draws it under the strokes when asked (checked by rendering with poppler's
// pdftoppm and reading pixels).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import * as passesRoute from '@/app/api/gags/[gagId]/passes/route';
import * as opsRoute from '@/app/api/passes/[passId]/ops/route';
import * as restoreRoute from '@/app/api/passes/[passId]/revisions/[revisionId]/restore/route';
import * as revisionsRoute from '@/app/api/passes/[passId]/revisions/route';
import * as passRoute from '@/app/api/passes/[passId]/route';
import * as uploadsRoute from '@/app/api/series/[seriesId]/uploads/route';
import * as uploadRoute from '@/app/api/uploads/[uploadId]/route';
import * as reviewRoute from '@/app/api/volumes/[volumeId]/export/review.pdf/route';
import * as findingsRoute from '@/app/api/passes/[passId]/findings/route';
import { findVolume, listEntries } from '@/db/queries/volumes';
import { DEMO_VOLUME_ID } from '@/db/seed/demo-data';
import { panelRects } from '@/lib/print/geometry';
import type { Lightbox } from '@/lib/strokes/types';
import { callRoute, callRouteRaw } from '../support/call-route';
import { useS3AndDb } from '../support/s3-fake';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, type Persona } from '../support/test-db';

const env = useS3AndDb();
const db = () => env.db();

async function upload(bytes: Buffer, name: string, seriesId = DEMO_SERIES_ID, as: Persona = 'cocreator') {
  const form = new FormData();
  form.append('file', new File([new Uint8Array(bytes)], name, { type: 'image/png' }));
  const r = await callRoute(uploadsRoute.POST, { method: 'POST', as, params: { seriesId }, form });
  expect(r.status).toBe(201);
  return r.body as { id: string; width: number; height: number };
}

/** A scan whose left half is red and right half blue, so a quarter turn shows. */
async function halves(w: number, h: number, format: 'png' | 'jpeg' | 'webp' = 'png') {
  const left = await sharp({ create: { width: Math.floor(w / 2), height: h, channels: 3, background: '#e01010' } })
    .png()
    .toBuffer();
  return sharp({ create: { width: w, height: h, channels: 3, background: '#1020e0' } })
    .composite([{ input: left, left: 0, top: 0 }])
    .toFormat(format)
    .toBuffer();
}

async function newPass(gagId: string) {
  const r = await callRoute(passesRoute.POST, { method: 'POST', as: 'cocreator', params: { gagId }, body: {} });
  expect(r.status).toBe(201);
  return r.body as { id: string; number: number };
}

const send = (passId: string, batchId: string, ops: unknown[], as: Persona = 'cocreator') =>
  callRoute(opsRoute.POST, { method: 'POST', as, params: { passId }, body: { batchId, ops } });

const state = async (passId: string) =>
  (await callRoute(passRoute.GET, { as: 'viewer', params: { passId } })).body as { seq: number; lightboxes: Lightbox[]; strokes: unknown[] };

const box = (id: string, uploadId: string, patch: Partial<Lightbox> = {}): Lightbox => ({
  id,
  uploadId,
  panel: 1,
  x: 80,
  y: 10,
  w: 60,
  h: 60,
  rotation: 0,
  opacity: 0.4,
  visible: true,
  ...patch,
});

describe('lightbox operations', () => {
  it('places a scan under panel 2, changes it, and reads it back; the delta carries only the change', async () => {
    const u = await upload(await halves(200, 200), 'pier-thumbs.png');
    const p = await newPass('demo-gag-10');
    expect((await send(p.id, 'lb-1', [{ op: 'lightbox', lightbox: box('lb', u.id) }])).status).toBe(200);
    const s1 = await state(p.id);
    expect(s1.lightboxes).toEqual([box('lb', u.id)]);
    expect(s1.strokes).toEqual([]); // never mixed with the strokes

    const turnedBox = box('lb', u.id, { rotation: 90, opacity: 0.7, visible: false });
    await send(p.id, 'lb-2', [{ op: 'lightbox', lightbox: turnedBox }]);
    const delta = await callRoute(passRoute.GET, { as: 'viewer', params: { passId: p.id }, url: `/?since=${s1.seq}` });
    expect(delta.body.lightboxes).toEqual([turnedBox]);
    expect(delta.body.removedLightboxes).toEqual([]);

    // The same value again writes nothing new.
    const rowsBefore = await db().selectFrom('lightboxes').select('rowId').where('passId', '=', p.id).execute();
    await send(p.id, 'lb-3', [{ op: 'lightbox', lightbox: turnedBox }]);
    const rowsAfter = await db().selectFrom('lightboxes').select('rowId').where('passId', '=', p.id).execute();
    expect(rowsAfter.length).toBe(rowsBefore.length);

    const s2 = await state(p.id);
    await send(p.id, 'lb-4', [{ op: 'unlightbox', lightboxId: 'lb' }]);
    const gone = await callRoute(passRoute.GET, { as: 'viewer', params: { passId: p.id }, url: `/?since=${s2.seq}` });
    expect(gone.body.removedLightboxes).toEqual(['lb']);
    // Taking away is final for the id: a late re-place of it is ignored.
    await send(p.id, 'lb-5', [{ op: 'lightbox', lightbox: box('lb', u.id) }]);
    expect((await state(p.id)).lightboxes).toEqual([]);
  });

  it('is not part of the ink load', async () => {
    const u = await upload(await halves(210, 210), 'ink-free.png');
    const p = await newPass('demo-gag-10');
    await send(p.id, 'ink-1', [{ op: 'lightbox', lightbox: box('full', u.id, { panel: null, x: -3, y: -3, w: 156, h: 156, opacity: 1 }) }]);
    const f = await callRoute(findingsRoute.GET, { as: 'viewer', params: { passId: p.id } });
    expect(f.status).toBe(200);
    expect(f.body.panels.map((x: { inkLoad: number }) => x.inkLoad)).toEqual([0, 0, 0, 0]);
  });

  it('refuses bad placements with a clear 422 and changes nothing', async () => {
    const mine = await upload(await halves(220, 220), 'mine.png');
    const theirs = await upload(await halves(230, 230), 'theirs.png', OTHER_SERIES_ID, 'outsider');
    const p = await newPass('demo-gag-10');
    const before = await state(p.id);
    const cases: [unknown, RegExp][] = [
      [box('a', theirs.id), /no upload .* in this series/],
      [box('b', 'no-such-upload'), /no upload .* in this series/],
      [box('c', mine.id, { rotation: 45 as Lightbox['rotation'] }), /Rotation/],
      [box('d', mine.id, { opacity: 0 }), /Opacity/],
      [box('e', mine.id, { x: 500 }), /wholly outside panel 2/],
      [box('f', mine.id, { w: 0 }), /at least 1 mm/],
    ];
    for (const [lightbox, message] of cases) {
      const r = await send(p.id, `bad-${(lightbox as Lightbox).id}`, [{ op: 'lightbox', lightbox }]);
      expect(r.status, JSON.stringify(lightbox)).toBe(422);
      expect(JSON.stringify(r.body)).toMatch(message);
    }
    expect(await state(p.id)).toEqual(before);
  });

  it('a scan deleted by someone else does not refuse a stroke drawn beside a nudge of it: the stroke lands, the nudge is skipped and said', async () => {
    const u = await upload(await halves(260, 260), 'soon-gone.png');
    const p = await newPass('demo-gag-10');
    await send(p.id, 'gone-1', [{ op: 'lightbox', lightbox: box('g', u.id) }]);
    // B deletes the scan, confirming although a pass still places it.
    const del = await callRoute(uploadRoute.DELETE, { method: 'DELETE', as: 'owner', params: { uploadId: u.id }, url: '/?confirm=1' });
    expect(del.status).toBe(204);
    const stroke = {
      id: 'beside',
      panel: 1,
      tool: 'pen',
      grey: 100,
      size: 0.5,
      points: [
        [90, 20, 0.5],
        [100, 30, 0.5],
      ],
    };
    const r = await send(p.id, 'gone-2', [
      { op: 'add', stroke },
      { op: 'lightbox', lightbox: box('g', u.id, { x: 85 }) },
    ]);
    expect(r.status).toBe(200);
    expect(r.body.skipped).toEqual([{ op: 'lightbox', id: 'g', reason: expect.stringMatching(/no upload .* in this series/) }]);
    const after = await state(p.id);
    expect((after.strokes as { id: string }[]).map((s) => s.id)).toEqual(['beside']);
    expect(after.lightboxes).toEqual([expect.objectContaining({ id: 'g', x: box('g', u.id).x })]);
  });

  it('an editor or viewer cannot place one', async () => {
    const u = await upload(await halves(240, 240), 'look-only.png');
    const p = await newPass('demo-gag-10');
    for (const as of ['editor', 'viewer'] as const)
      expect((await send(p.id, `ro-${as}`, [{ op: 'lightbox', lightbox: box('x', u.id) }], as)).status).toBe(403);
    expect((await state(p.id)).lightboxes).toEqual([]);
  });

  it('a restore brings back the placement of the revision; a copied pass keeps it', async () => {
    const u = await upload(await halves(250, 250), 'restore-me.png');
    const p = await newPass('demo-gag-10');
    const first = box('r1', u.id, { opacity: 0.3 });
    await send(p.id, 'rs-1', [{ op: 'lightbox', lightbox: first }]);
    const mark = (await state(p.id)).seq;
    // A revision at this point, then changes after it.
    await db()
      .insertInto('revisions')
      .values({
        id: 'rev-lightbox-mark',
        passId: p.id,
        seq: mark,
        reason: 'pause',
        restoredFrom: null,
        userId: null,
        createdAt: new Date().toISOString(),
      })
      .execute();
    await send(p.id, 'rs-2', [
      { op: 'lightbox', lightbox: { ...first, x: 90, opacity: 0.9 } },
      { op: 'lightbox', lightbox: box('r2', u.id, { panel: 3, x: 80, y: 80 }) },
    ]);
    expect((await state(p.id)).lightboxes).toHaveLength(2);
    const revs = await callRoute(revisionsRoute.GET, { as: 'viewer', params: { passId: p.id } });
    expect(revs.body.map((r: { id: string }) => r.id)).toContain('rev-lightbox-mark');
    const r = await callRoute(restoreRoute.POST, { method: 'POST', as: 'cocreator', params: { passId: p.id, revisionId: 'rev-lightbox-mark' } });
    expect(r.status).toBe(200);
    expect((await state(p.id)).lightboxes).toEqual([first]);

    const copy = await callRoute(passesRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { gagId: 'demo-gag-10' },
      body: { copyFrom: p.number },
    });
    expect(copy.status).toBe(201);
    expect((await state(copy.body.id)).lightboxes).toEqual([first]);
  });
});

describe('deleting an upload a pass still uses', () => {
  it('answers 409 naming the passes, and deletes only when confirmed', async () => {
    const u = await upload(await halves(260, 260), 'still-used.png');
    const p = await newPass('demo-gag-10');
    await send(p.id, 'use-1', [{ op: 'lightbox', lightbox: box('used', u.id) }]);
    const list = await callRoute(uploadsRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } });
    expect(list.body.find((x: { id: string }) => x.id === u.id).passesUsing).toBe(1);

    const asked = await callRoute(uploadRoute.DELETE, { method: 'DELETE', as: 'cocreator', params: { uploadId: u.id } });
    expect(asked.status).toBe(409);
    expect(asked.body.error).toMatch(new RegExp(`pass ${p.number} of “`));
    expect(asked.body.usedBy).toEqual([expect.objectContaining({ passId: p.id, passNumber: p.number })]);
    expect(await db().selectFrom('uploads').select('id').where('id', '=', u.id).executeTakeFirst()).toBeDefined();

    const done = await callRoute(uploadRoute.DELETE, { method: 'DELETE', as: 'cocreator', params: { uploadId: u.id }, url: '/?confirm=1' });
    expect(done.status).toBe(204);
    expect(await db().selectFrom('uploads').select('id').where('id', '=', u.id).executeTakeFirst()).toBeUndefined();
    // The pass keeps its placement (an empty frame in the editor); nothing in its log is lost.
    expect((await state(p.id)).lightboxes.map((l) => l.id)).toEqual(['used']);
  });

  it('an upload no pass uses any more is deleted without asking', async () => {
    const u = await upload(await halves(270, 270), 'was-used.png');
    const p = await newPass('demo-gag-10');
    await send(p.id, 'unuse-1', [{ op: 'lightbox', lightbox: box('w', u.id) }]);
    await send(p.id, 'unuse-2', [{ op: 'unlightbox', lightboxId: 'w' }]);
    const r = await callRoute(uploadRoute.DELETE, { method: 'DELETE', as: 'cocreator', params: { uploadId: u.id } });
    expect(r.status).toBe(204);
  });
});

describe('review PDF with the lightbox', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-lightbox-pdf-'));
  const DPI = 40;

  /** Renders one page with pdftoppm and returns its pixels. */
  async function render(res: Response, page: number, name: string) {
    const file = path.join(dir, `${name}.pdf`);
    fs.writeFileSync(file, Buffer.from(await res.arrayBuffer()));
    execFileSync('pdftoppm', ['-f', String(page), '-l', String(page), '-r', String(DPI), '-png', '-singlefile', file, path.join(dir, name)]);
    const { data, info } = await sharp(path.join(dir, `${name}.png`))
      .removeAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    return (xMm: number, yMm: number, bleed: number): [number, number, number] => {
      const px = Math.round(((xMm + bleed) / 25.4) * DPI);
      const py = Math.round(((yMm + bleed) / 25.4) * DPI);
      const i = (py * info.width + px) * 3;
      return [data[i]!, data[i + 1]!, data[i + 2]!];
    };
  }

  it('draws the scan under the strokes when asked, turned as placed, and not otherwise', async () => {
    const entries = await listEntries(db(), DEMO_VOLUME_ID);
    const at = entries.findIndex((e) => e.kind === 'gag' && e.latestPass);
    const entry = entries[at]!;
    const { spec } = (await findVolume(db(), DEMO_VOLUME_ID))!;
    const panel = panelRects(spec)[1]!;
    // WebP, so the export's conversion to PNG is exercised too.
    const u = await upload(await halves(300, 300, 'webp'), 'turned-scan.webp');
    // Fill panel 2 and turn a quarter clockwise: the red left half goes to the top.
    await send(entry.latestPass!.id, 'pdf-1', [
      { op: 'lightbox', lightbox: box('pdf', u.id, { panel: 1, x: panel.x, y: panel.y, w: panel.w, h: panel.h, rotation: 90, opacity: 1 }) },
    ]);
    const cx = panel.x + panel.w / 2;
    const top = panel.y + panel.h * 0.2;
    const bottom = panel.y + panel.h * 0.8;

    const withScan = await callRouteRaw(reviewRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID }, url: '/?lightbox=1' });
    expect(withScan.status).toBe(200);
    const px = await render(withScan, at + 1, 'with');
    const [r1, , b1] = px(cx, top, spec.bleed);
    const [r2, , b2] = px(cx, bottom, spec.bleed);
    expect(r1).toBeGreaterThan(150); // red on top
    expect(b1).toBeLessThan(100);
    expect(b2).toBeGreaterThan(150); // blue below
    expect(r2).toBeLessThan(100);

    const without = await callRouteRaw(reviewRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    const plain = await render(without, at + 1, 'without');
    const [r3, g3, b3] = plain(cx, top, spec.bleed);
    // White paper, or a demo stroke's grey: never the scan's red.
    expect(Math.abs(r3 - g3)).toBeLessThan(20);
    expect(Math.abs(r3 - b3)).toBeLessThan(20);

    const bad = await callRouteRaw(reviewRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID }, url: '/?lightbox=yes' });
    expect(bad.status).toBe(422);
  });
});
