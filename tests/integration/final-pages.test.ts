// Final pages through the upload pipeline: TIFF (1-bit LZW and CCITT, 8-bit Deflate), PNG and
// JPEG accepted by their bytes, the pixels kept exactly as they came (compared decoded), upright,
// private metadata gone; the facts recorded; replacing keeps the history and can go back; the
// gag's status follows; refusals store nothing.
import { randomUUID } from 'node:crypto';
import { crc32, deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import * as currentRoute from '@/app/api/final-pages/[finalPageId]/current/route';
import * as fitRoute from '@/app/api/final-pages/[finalPageId]/fit/route';
import * as entryRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/route';
import * as imageRoute from '@/app/api/final-pages/[finalPageId]/image/[variant]/route';
import * as gagFinalRoute from '@/app/api/gags/[gagId]/final-pages/route';
import * as gagRoute from '@/app/api/gags/[gagId]/route';
import * as entryFinalRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/final-pages/route';
import { createGag } from '@/db/queries/gags';
import { addEntry, createVolume } from '@/db/queries/volumes';
import { callRoute, callRouteRaw } from '../support/call-route';
import { form, greyPng, greyTiff, jpegWithExif, lineArtTiff, pixels, rgbPng } from '../support/scans';
import { useS3AndDb } from '../support/s3-fake';
import { DEMO_SERIES_ID, countRows } from '../support/test-db';

/** A PNG signature, an IHDR chunk (PNG spec §11.2.2) for 8-bit grey at this size, the first rows' data and IEND. */
function pngHeaderOnly(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const out = Buffer.alloc(12 + data.length);
    out.writeUInt32BE(data.length, 0);
    out.write(type, 4, 'latin1');
    data.copy(out, 8);
    out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 0; // greyscale
  return Buffer.concat([
    Buffer.from('89504e470d0a1a0a', 'hex'),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(Buffer.alloc(width + 1))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

const env = useS3AndDb();

async function newGag(status: 'inked' | 'idea' = 'inked') {
  const id = randomUUID();
  await createGag(env.db(), { id, seriesId: DEMO_SERIES_ID, title: `Final ${id.slice(0, 4)}`, premise: '', status });
  return id;
}

const post = (gagId: string, f: FormData, as: 'owner' | 'cocreator' = 'cocreator') =>
  callRoute(gagFinalRoute.POST, { method: 'POST', as, params: { gagId }, form: f });

async function kept(finalPageId: string): Promise<Buffer> {
  const res = await callRouteRaw(imageRoute.GET, { as: 'viewer', params: { finalPageId, variant: 'kept' } });
  expect(res.status).toBe(200);
  return Buffer.from(await res.arrayBuffer());
}

// A page of the demo volume's size with its bleed: 156 mm square (150 mm trim + 2 × 3 mm).
const PAGE = { w: 156, h: 156 };
const ART = [
  { x: 10, y: 10, w: 60, h: 0.5 },
  { x: 40, y: 30, w: 0.5, h: 40 },
  { x: 90, y: 90, w: 20, h: 20 },
];

describe('accepted scans keep their pixels', () => {
  it('1-bit LZW TIFF at 600 ppi: line art, 1 bit per pixel, the same pixels, kept 1-bit', async () => {
    const scan = await lineArtTiff({ ...PAGE, ppi: 600, marks: ART }, 'lzw');
    const r = await post(await newGag(), form(scan, 'page-12.tif', 'image/tiff'));
    expect(r.status).toBe(201);
    // 156 mm at 600 ppi = 156 / 25.4 × 600 = 3685.04 → 3685 px (1 in = 25.4 mm).
    expect(r.body).toMatchObject({ width: 3685, height: 3685, bitsPerPixel: 1, colour: 'line', ppi: 600, mime: 'image/tiff', current: true });
    expect(r.body.fit).toEqual({ to: 'bleed', x: 0, y: 0, scale: 1, rotation: 0 }); // drawn with its bleed
    const k = await kept(r.body.id);
    const meta = await sharp(k).metadata();
    expect(meta).toMatchObject({ format: 'tiff', bitsPerSample: 1, width: 3685, height: 3685, density: 600 });
    expect((await pixels(k)).data.equals((await pixels(scan)).data)).toBe(true);
  });

  it('1-bit CCITT group 4 and 8-bit Deflate TIFFs', async () => {
    const g4 = await lineArtTiff({ w: 40, h: 30, ppi: 600, marks: ART.slice(0, 2) }, 'ccittfax4');
    const a = await post(await newGag(), form(g4, 'g4.tif', 'image/tiff'));
    expect(a.status).toBe(201);
    expect(a.body).toMatchObject({ bitsPerPixel: 1, colour: 'line' });
    const tone = await greyTiff({ w: 40, h: 30, ppi: 300, tone: 170, marks: ART.slice(0, 2) }, 'deflate');
    const b = await post(await newGag(), form(tone, 'tone.tif', 'image/tiff'));
    expect(b.status).toBe(201);
    expect(b.body).toMatchObject({ bitsPerPixel: 8, colour: 'grey', ppi: 300 });
    expect((await pixels(await kept(b.body.id))).data.equals((await pixels(tone)).data)).toBe(true);
  });

  it('PNG: grey and colour, kept as lossless TIFF with the same pixels and resolution', async () => {
    const grey = await greyPng({ w: 40, h: 30, ppi: 150, tone: 200, marks: ART.slice(0, 1) });
    const a = await post(await newGag(), form(grey, 'soft.png', 'image/png'));
    expect(a.body).toMatchObject({ bitsPerPixel: 8, colour: 'grey', ppi: 150, mime: 'image/png' });
    const ka = await kept(a.body.id);
    expect((await sharp(ka).metadata()).density).toBe(150);
    expect((await pixels(ka)).data.equals((await pixels(grey)).data)).toBe(true);
    const colour = await rgbPng({ w: 40, h: 30, ppi: 300, marks: [{ x: 5, y: 5, w: 4, h: 4, colour: '#d01010' }] });
    const b = await post(await newGag(), form(colour, 'red.png', 'image/png'));
    expect(b.body).toMatchObject({ bitsPerPixel: 24, colour: 'rgb' });
    expect((await pixels(await kept(b.body.id), 3)).data.equals((await pixels(colour, 3)).data)).toBe(true);
  });

  it('JPEG: the compressed image kept byte for byte, Exif (GPS included) gone', async () => {
    const jpeg = await jpegWithExif({ w: 40, h: 30, ppi: 300, tone: 150, marks: ART.slice(0, 2) }, { grey: true });
    expect((await sharp(jpeg).metadata()).exif).toBeDefined();
    const r = await post(await newGag(), form(jpeg, 'phone.jpg', 'image/jpeg'));
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ mime: 'image/jpeg', bitsPerPixel: 8, colour: 'grey', ppi: 300 });
    const k = await kept(r.body.id);
    const meta = await sharp(k).metadata();
    expect(meta.format).toBe('jpeg');
    expect(meta.exif).toBeUndefined();
    expect(k.includes(Buffer.from('GPS'))).toBe(false);
    expect(k.includes(Buffer.from('Kettle Crab studio'))).toBe(false);
    // From the start of scan (FF DA) to the end, the same bytes: no re-encoding (ITU-T T.81 Annex B).
    const sos = (b: Buffer) => b.subarray(b.indexOf(Buffer.from([0xff, 0xda])));
    expect(sos(k).equals(sos(jpeg))).toBe(true);
    expect((await pixels(k)).data.equals((await pixels(jpeg)).data)).toBe(true);
  });

  it('a JPEG turned by its Exif orientation is made upright (a quarter turn: pixels moved, not resampled)', async () => {
    const jpeg = await jpegWithExif({ w: 40, h: 20, ppi: 300, marks: ART.slice(0, 1) }, { orientation: 6 });
    const r = await post(await newGag(), form(jpeg, 'sideways.jpg', 'image/jpeg'));
    expect(r.status).toBe(201);
    const raw = await sharp(jpeg).metadata();
    expect([r.body.width, r.body.height]).toEqual([raw.height, raw.width]); // orientation 6: 90° clockwise
    const k = await kept(r.body.id);
    expect((await sharp(k).metadata()).orientation ?? 1).toBe(1);
    expect((await pixels(k, 3)).data.equals((await pixels(jpeg, 3)).data)).toBe(true); // pixels() turns the upload upright too
  });
});

describe('refused uploads store nothing', () => {
  it('415 for another type, 422 for a damaged file, 413 over the pixel limit', async () => {
    const gagId = await newGag();
    const before = await countRows(env.db(), ['finalPages', 'gags']);
    const gif = Buffer.from('47494638396101000100800000000000ffffff21f90401000000002c00000000010001000002024401003b', 'hex');
    const a = await post(gagId, form(gif, 'dot.gif', 'image/gif'));
    expect(a.status).toBe(415);
    expect(a.body.error).toMatch(/TIFF, PNG or JPEG/);
    // A PNG cut short: its signature and header read, its image data does not.
    const png = await greyPng({ w: 40, h: 30, ppi: 300, tone: 100, marks: ART.slice(0, 2) });
    const b = await post(gagId, form(png.subarray(0, Math.floor(png.length / 2)), 'cut.png', 'image/png'));
    expect(b.status).toBe(422);
    // A PNG header saying 13,000 × 12,000 px (156 megapixels, 8-bit grey): refused from its header, before any decoding.
    const huge = pngHeaderOnly(13_000, 12_000);
    const c = await post(gagId, form(huge, 'huge.png', 'image/png'));
    expect(c.status).toBe(413);
    expect(await countRows(env.db(), ['finalPages', 'gags'])).toEqual(before);
    expect((await callRoute(gagRoute.GET, { as: 'viewer', params: { gagId } })).body.status).toBe('inked');
  });
  it('a viewer or an editor may not upload (403); an outsider sees nothing (404)', async () => {
    const gagId = await newGag();
    const f = () => form(Buffer.from('x'), 'x.png', 'image/png');
    expect((await callRoute(gagFinalRoute.POST, { method: 'POST', as: 'viewer', params: { gagId }, form: f() })).status).toBe(403);
    expect((await callRoute(gagFinalRoute.POST, { method: 'POST', as: 'editor', params: { gagId }, form: f() })).status).toBe(403);
    expect((await callRoute(gagFinalRoute.GET, { as: 'outsider', params: { gagId } })).status).toBe(404);
  });
});

describe('history, going back, and the status', () => {
  it('an upload makes the gag "scanned"; a replacement keeps the earlier one (who, when); going back works', async () => {
    const gagId = await newGag('inked');
    const first = await post(gagId, form(await greyTiff({ w: 40, h: 30, ppi: 300, tone: 120 }), 'first.tif', 'image/tiff'), 'owner');
    expect((await callRoute(gagRoute.GET, { as: 'viewer', params: { gagId } })).body.status).toBe('scanned');
    const second = await post(gagId, form(await greyTiff({ w: 40, h: 30, ppi: 300, tone: 90 }), 'second.tif', 'image/tiff'));
    const list = (await callRoute(gagFinalRoute.GET, { as: 'viewer', params: { gagId } })).body;
    expect(list.map((p: { id: string }) => p.id)).toEqual([second.body.id, first.body.id]); // newest first
    expect(list.map((p: { current: boolean }) => p.current)).toEqual([true, false]);
    expect(list[1]).toMatchObject({ name: 'first.tif', by: 'Nell Harrow' });
    expect(list[0]).toMatchObject({ name: 'second.tif', by: 'Tam Quill' });
    const back = await callRoute(currentRoute.POST, { method: 'POST', as: 'owner', params: { finalPageId: first.body.id } });
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ id: first.body.id, current: true, madeCurrentBy: 'Nell Harrow' });
    const after = (await callRoute(gagFinalRoute.GET, { as: 'viewer', params: { gagId } })).body;
    expect(after.map((p: { current: boolean }) => p.current)).toEqual([false, true]);
    expect(after).toHaveLength(2);
    // The same file again is not stored twice: it becomes current again.
    const again = await post(gagId, form(await greyTiff({ w: 40, h: 30, ppi: 300, tone: 90 }), 'second-again.tif', 'image/tiff'));
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ id: second.body.id, duplicate: true, current: true });
  });
  it('"scanned" and "placed" cannot be set by hand against the art', async () => {
    const gagId = await newGag('inked');
    const r = await callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'owner', params: { gagId }, body: { status: 'scanned' } });
    expect(r.status).toBe(422);
    expect(r.body.error).toMatch(/final page/);
  });
});

describe('matter pages', () => {
  it('a title page takes a final page; a gag entry is refused with where to go; another volume’s entry is 404', async () => {
    const db = env.db();
    const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Matter', deadline: '2027-03-13' });
    const title = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'title' });
    const gagEntry = await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: await newGag() });
    const other = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Other', deadline: '2027-03-13' });
    const scan = () => form(Buffer.from([]), 'x.tif', 'image/tiff');
    const ok = await callRoute(entryFinalRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { volumeId: v.id, entryId: title.id },
      form: form(await lineArtTiff({ w: 156, h: 156, ppi: 600, marks: ART }), 'title.tif', 'image/tiff'),
    });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ entryId: title.id, gagId: null, colour: 'line' });
    const listed = await callRoute(entryFinalRoute.GET, { as: 'viewer', params: { volumeId: v.id, entryId: title.id } });
    expect(listed.body.map((p: { id: string }) => p.id)).toEqual([ok.body.id]);
    const gagOne = await callRoute(entryFinalRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { volumeId: v.id, entryId: gagEntry.id },
      form: scan(),
    });
    expect(gagOne.status).toBe(422);
    expect(gagOne.body.error).toMatch(/\/api\/gags\/:gagId\/final-pages/);
    const elsewhere = await callRoute(entryFinalRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { volumeId: other.id, entryId: title.id },
      form: scan(),
    });
    expect(elsewhere.status).toBe(404);
  });
});

describe('fitting', () => {
  it('a fit is stored and counts as fitted; in a running order the gag is "placed", taken out it is "scanned" again', async () => {
    const db = env.db();
    const gagId = await newGag('inked');
    const up = await post(gagId, form(await greyTiff({ w: 150, h: 150, ppi: 300, tone: 140 }), 'trim.tif', 'image/tiff'));
    expect(up.body).toMatchObject({ fitted: false, fit: { to: 'trim' } });
    const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Fit', deadline: '2027-03-13' });
    const entry = await addEntry(db, v.id, DEMO_SERIES_ID, { gagId });
    const status = async () => (await callRoute(gagRoute.GET, { as: 'viewer', params: { gagId } })).body.status;
    expect(await status()).toBe('scanned'); // not fitted yet
    const fit = { to: 'bleed', x: 1.5, y: -0.5, scale: 1.02, rotation: 0 };
    const r = await callRoute(fitRoute.PUT, { method: 'PUT', as: 'cocreator', params: { finalPageId: up.body.id }, body: fit });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ fit, fitted: true });
    expect(await status()).toBe('placed');
    expect((await callRoute(entryRoute.DELETE, { method: 'DELETE', as: 'owner', params: { volumeId: v.id, entryId: entry.id } })).status).toBe(204);
    expect(await status()).toBe('scanned');
    await addEntry(db, v.id, DEMO_SERIES_ID, { gagId });
    expect(await status()).toBe('placed');
  });
  it('a bad fit is 422 and changes nothing; a viewer may not fit (403)', async () => {
    const gagId = await newGag('inked');
    const up = await post(gagId, form(await greyTiff({ w: 40, h: 30, ppi: 300, tone: 60 }), 'a.tif', 'image/tiff'));
    const before = await countRows(env.db(), ['finalPages']);
    for (const body of [
      { to: 'trim', x: 0, y: 0, scale: 1, rotation: 45 },
      { to: 'page', x: 0, y: 0, scale: 1, rotation: 0 },
      { to: 'trim', x: 0, y: 0, scale: 0, rotation: 0 },
      { to: 'trim', x: 'left', y: 0, scale: 1, rotation: 0 },
      { to: 'trim', x: 0, y: 0, scale: 1, rotation: 0, extra: 1 },
    ]) {
      const r = await callRoute(fitRoute.PUT, { method: 'PUT', as: 'owner', params: { finalPageId: up.body.id }, body });
      expect(r.status, JSON.stringify(body)).toBe(422);
      expect(typeof r.body.error).toBe('string');
    }
    const viewer = await callRoute(fitRoute.PUT, {
      method: 'PUT',
      as: 'viewer',
      params: { finalPageId: up.body.id },
      body: { to: 'trim', x: 0, y: 0, scale: 1, rotation: 0 },
    });
    expect(viewer.status).toBe(403);
    expect(await countRows(env.db(), ['finalPages'])).toEqual(before);
    const after = (await callRoute(gagFinalRoute.GET, { as: 'viewer', params: { gagId } })).body[0];
    expect(after).toMatchObject({ fitted: false, fit: up.body.fit });
  });
});
