// The print file and the cover file, read back with poppler (Debian's poppler-utils):
// `pdfinfo -box` for the page boxes, `pdfimages -list` for each image's pixels, colour,
// bits per component and ppi, `pdffonts` for fonts. The trim is 5.5 × 8.5 in with a
// 0.125 in bleed — not square, so a swapped width and height fails. Check values:
// 1 in = 25.4 mm and 1 pt = 1/72 in (by definition); MediaBox = BleedBox ⊇ TrimBox
// (ISO 32000-1 §14.11.2); the line-art and tone resolutions (600 / 300 ppi) and the
// spine width (pages ÷ 2 × caliper) are common practice.
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import fontkit from '@pdf-lib/fontkit';
import { PDFDict, PDFDocument, PDFName, PDFRawStream, decodePDFRawStream } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import * as fitRoute from '@/app/api/final-pages/[finalPageId]/fit/route';
import * as preflightRoute from '@/app/api/volumes/[volumeId]/preflight/route';
import * as entryFinalRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/final-pages/route';
import * as gagFinalRoute from '@/app/api/gags/[gagId]/final-pages/route';
import * as passesRoute from '@/app/api/gags/[gagId]/passes/route';
import * as opsRoute from '@/app/api/passes/[passId]/ops/route';
import * as jobRoute from '@/app/api/print-jobs/[jobId]/route';
import * as jobFileRoute from '@/app/api/print-jobs/[jobId]/file/route';
import * as jobsRoute from '@/app/api/volumes/[volumeId]/print-jobs/route';
import * as coverRoute from '@/app/api/volumes/[volumeId]/export/cover.pdf/route';
import * as printRoute from '@/app/api/volumes/[volumeId]/export/print.pdf/route';
import { createGag } from '@/db/queries/gags';
import { addEntry, createVolume } from '@/db/queries/volumes';
import { findPrintJob, retireOldPrintFiles } from '@/db/queries/print-jobs';
import { retireOldFiles } from '@/lib/export/print-jobs';
import { PROOF_MARK } from '@/lib/export/print-pdf';
import { sfntFromWoff } from '@/lib/export/woff';
import { panelRects } from '@/lib/print/geometry';
import type { Stroke } from '@/lib/strokes/types';
import { getObjectStream, putObject } from '@/lib/storage/s3';
import { callRoute, callRouteRaw } from '../support/call-route';
import { form, greyTiff, jpegWithExif, lineArtTiff, rgbPng } from '../support/scans';
import { useS3AndDb } from '../support/s3-fake';
import { lum, renderPage, rgbAt } from '../support/pixels';
import { pdfBoxesOf as boxes, pdfFontsOf as fonts, pdfImagesOf as images } from '../support/poppler';
import { DEMO_SERIES_ID, PERSONAS } from '../support/test-db';

const env = useS3AndDb();

const IN = 25.4; // mm per inch, exact
const PT = 72; // points per inch
const TRIM = { w: 5.5 * IN, h: 8.5 * IN };
const BLEED = 0.125 * IN;
// The scans cover the trim plus the bleed: 5.75 × 8.75 in.
const SCAN = { w: TRIM.w + 2 * BLEED, h: TRIM.h + 2 * BLEED };
const SPEC = { trimW: TRIM.w, trimH: TRIM.h, bleed: BLEED, safe: 6, gutter: 4 };

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-print-'));
async function save(res: Response, name: string) {
  const file = path.join(dir, name);
  fs.writeFileSync(file, Buffer.from(await res.arrayBuffer()));
  return file;
}

const near = (a: number[], b: number[], tol = 0.01) => a.forEach((v, i) => expect(Math.abs(v - b[i]!)).toBeLessThanOrEqual(tol));

async function gagWithScan(scan: Buffer, name: string, type: string) {
  const gagId = randomUUID();
  await createGag(env.db(), { id: gagId, seriesId: DEMO_SERIES_ID, title: name, premise: '', status: 'inked' });
  const up = await callRoute(gagFinalRoute.POST, { method: 'POST', as: 'cocreator', params: { gagId }, form: form(scan, name, type) });
  expect(up.status).toBe(201);
  return { gagId, finalPageId: up.body.id as string };
}

/** Fits a final page to the bleed (the scans here are drawn with it), at a scale. */
async function fitToBleed(finalPageId: string, scale = 1) {
  const r = await callRoute(fitRoute.PUT, {
    method: 'PUT',
    as: 'cocreator',
    params: { finalPageId },
    body: { to: 'bleed', x: 0, y: 0, scale, rotation: 0 },
  });
  expect(r.status).toBe(200);
}

/** A perfect-bound volume of the test's trim, 0.12 mm paper. */
const perfectBound = (db: ReturnType<typeof env.db>, title: string) =>
  createVolume(db, { seriesId: DEMO_SERIES_ID, title, deadline: '2027-03-13', spec: { ...SPEC, binding: 'perfect', caliperUm: 120 } });

async function matterScan(volumeId: string, entryId: string, scan: Buffer, name: string, type: string) {
  const up = await callRoute(entryFinalRoute.POST, { method: 'POST', as: 'owner', params: { volumeId, entryId }, form: form(scan, name, type) });
  expect(up.status).toBe(201);
}

/** A gag in pencil only: passes 1 and 2, each with one thick horizontal stroke across panel 0 at `ys[i]` mm down the trim. */
async function gagInPencil(title: string, ys: number[]) {
  const gagId = randomUUID();
  await createGag(env.db(), { id: gagId, seriesId: DEMO_SERIES_ID, title, premise: '', status: 'thumbnailing' });
  const p0 = panelRects(SPEC)[0]!;
  for (const [i, y] of ys.entries()) {
    const pass = await callRoute(passesRoute.POST, { method: 'POST', as: 'cocreator', params: { gagId }, body: {} });
    expect(pass.status).toBe(201);
    expect(pass.body.number).toBe(i + 1);
    const points = Array.from({ length: 21 }, (_, k) => [p0.x + 5 + (k * (p0.w - 10)) / 20, y, 1] as [number, number, number]);
    const stroke: Stroke = { id: `pencil-${i + 1}`, panel: 0, tool: 'pen', grey: 100, size: 3, points };
    const ops = await callRoute(opsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { passId: pass.body.id },
      body: { batchId: `pencil-${gagId}-${i}`, ops: [{ op: 'add', stroke }] },
    });
    expect(ops.status).toBe(200);
  }
  return { gagId, across: p0.x + p0.w / 2 };
}

/** Each word `pdftotext -bbox` finds on a page, in pt from the page's top left (as pdftotext measures). */
function wordsOn(file: string, page: number) {
  const html = execFileSync('pdftotext', ['-bbox', '-f', String(page), '-l', String(page), file, '-'], { encoding: 'utf8' });
  return [...html.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g)].map((m) => ({
    x0: Number(m[1]),
    top: Number(m[2]),
    x1: Number(m[3]),
    bottom: Number(m[4]),
    text: m[5]!,
  }));
}

/** Whether a word's box, top-down in pt, overlaps a PDF box ([x0, y0, x1, y1], bottom-up) on a page `pageH` pt high. */
const overlaps = (w: ReturnType<typeof wordsOn>[number], box: number[], pageH: number) =>
  w.x0 < box[2]! && w.x1 > box[0]! && w.top < pageH - box[1]! && w.bottom > pageH - box[3]!;

/** The glyphs in each font program a PDF embeds (FontFile2), as fontkit counts them. */
async function embeddedGlyphCounts(file: string): Promise<number[]> {
  const doc = await PDFDocument.load(fs.readFileSync(file));
  return doc.context
    .enumerateIndirectObjects()
    .flatMap(([, o]) => {
      const program = o instanceof PDFDict ? o.lookup(PDFName.of('FontFile2')) : undefined;
      return program instanceof PDFRawStream ? [program] : [];
    })
    .map((s) => (fontkit.create(Buffer.from(decodePDFRawStream(s).decode())) as { numGlyphs: number }).numGlyphs);
}

const jobCount = async (volumeId: string) =>
  Number(
    (
      await env
        .db()
        .selectFrom('printJobs')
        .select((eb) => eb.fn.countAll().as('n'))
        .where('volumeId', '=', volumeId)
        .executeTakeFirstOrThrow()
    ).n,
  );

async function untilDone(jobId: string) {
  for (let i = 0; i < 600; i++) {
    const r = await callRoute(jobRoute.GET, { as: 'viewer', params: { jobId } });
    expect(r.status).toBe(200);
    if (r.body.job.state === 'done' || r.body.job.state === 'failed') return r.body.job;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error('the job did not finish');
}

describe('the print file', () => {
  it('refuses while pages lack scans, builds a proof for the owner, then the print file at native pixels', async () => {
    const db = env.db();
    const v = await createVolume(db, {
      seriesId: DEMO_SERIES_ID,
      title: 'Kettle Crab print',
      deadline: '2027-03-13',
      spec: { ...SPEC, binding: 'saddle' },
    });
    const title = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'title' });
    const frame = [{ x: 10, y: 10, w: 120, h: 1 }];
    const line = await gagWithScan(await lineArtTiff({ ...SCAN, ppi: 600, marks: frame }, 'ccittfax4'), 'line.tif', 'image/tiff');
    const tone = await gagWithScan(await greyTiff({ ...SCAN, ppi: 300, tone: 200, marks: frame }), 'tone.tif', 'image/tiff');
    const red = await gagWithScan(
      await rgbPng({ ...SCAN, ppi: 300, marks: [{ x: 40, y: 40, w: 10, h: 10, colour: '#d01010' }] }),
      'red.png',
      'image/png',
    );
    // The gags' pages were fitted on the series' square page; on this book's page a person fits them to its bleed,
    // the tone page a fifth larger than the bleed (its pixels then spread over more inches: 300 / 1.2 = 250 ppi).
    await fitToBleed(line.finalPageId);
    await fitToBleed(tone.finalPageId, 1.2);
    await fitToBleed(red.finalPageId);
    for (const g of [line, tone, red]) await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: g.gagId });
    await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'blank' }); // 5 pages: saddle stitch adds 3 blanks

    // Page 1 (the title page) has no scan: 409 with the list, nothing built.
    const refused = await callRoute(jobsRoute.POST, { method: 'POST', as: 'editor', params: { volumeId: v.id }, body: { kind: 'print' } });
    expect(refused.status).toBe(409);
    expect(refused.body.missing).toEqual([{ number: 1, label: 'Title page' }]);
    expect((await callRouteRaw(printRoute.GET, { as: 'cocreator', params: { volumeId: v.id } })).status).toBe(409);
    // A proof is the owner's to ask for; a viewer builds nothing; an outsider sees nothing.
    expect(
      (await callRoute(jobsRoute.POST, { method: 'POST', as: 'cocreator', params: { volumeId: v.id }, body: { kind: 'print', proof: true } })).status,
    ).toBe(403);
    expect((await callRoute(jobsRoute.POST, { method: 'POST', as: 'viewer', params: { volumeId: v.id }, body: { kind: 'print' } })).status).toBe(403);
    expect((await callRoute(jobsRoute.GET, { as: 'outsider', params: { volumeId: v.id } })).status).toBe(404);
    expect((await callRoute(jobsRoute.POST, { method: 'POST', as: 'owner', params: { volumeId: v.id }, body: { kind: 'poster' } })).status).toBe(422);

    const proofJob = await callRoute(jobsRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { volumeId: v.id },
      body: { kind: 'print', proof: true },
    });
    expect(proofJob.status).toBe(202);
    const proofDone = await untilDone(proofJob.body.job.id);
    expect(proofDone).toMatchObject({ state: 'done', proof: true, pages: 8 });
    const proofFile = await save(await callRouteRaw(jobFileRoute.GET, { as: 'viewer', params: { jobId: proofDone.id } }), 'proof.pdf');
    const pb = boxes(proofFile);
    expect(pb.pages).toBe(8);
    // The proof's marks are outside the bleed: its MediaBox is larger, the BleedBox and TrimBox the same size as the print file's.
    for (const [i, m] of pb.media.entries()) {
      expect(m[2]! - m[0]!).toBeGreaterThan(pb.bleed[i]![2]! - pb.bleed[i]![0]!);
      expect(pb.bleed[i]![2]! - pb.bleed[i]![0]!).toBeCloseTo((SCAN.w / IN) * PT, 2);
    }
    expect(execFileSync('pdftotext', [proofFile, '-'], { encoding: 'utf8' })).toMatch(/PROOF — NOT FOR PRINT · page 1 · Title page · NOT FINAL/);
    expect(fonts(proofFile).every((l) => / yes /.test(l))).toBe(true);

    // The title page's scan arrives (a grey JPEG): now the print file.
    await matterScan(v.id, title.id, await jpegWithExif({ ...SCAN, ppi: 300, marks: frame }, { grey: true }), 'title.jpg', 'image/jpeg');
    const res = await callRouteRaw(printRoute.GET, { as: 'editor', params: { volumeId: v.id } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const file = await save(res, 'print.pdf');

    const b = boxes(file);
    expect(b.pages).toBe(8); // 5 pages + 3 blanks: a multiple of 4 for saddle stitch
    const w = (SCAN.w / IN) * PT; // 414 pt
    const h = (SCAN.h / IN) * PT; // 630 pt
    const bl = (BLEED / IN) * PT; // 9 pt
    for (let i = 0; i < 8; i++) {
      near(b.media[i]!, [0, 0, w, h]);
      near(b.bleed[i]!, [0, 0, w, h]);
      near(b.trim[i]!, [bl, bl, w - bl, h - bl]);
    }
    expect(fonts(file)).toEqual([]); // no text in the print file, so no font to embed

    const imgs = images(file);
    // Running order: title (JPEG 300), line (1-bit 600), tone (grey 300), red (made grey, 300), blank; then 3 added blanks.
    expect(imgs.map((i) => i.page)).toEqual([1, 2, 3, 4]);
    const px = (mm: number, ppi: number) => Math.round((mm / IN) * ppi);
    expect(imgs[0]).toMatchObject({ width: px(SCAN.w, 300), height: px(SCAN.h, 300), color: 'gray', bpc: 8, enc: 'jpeg', xppi: 300, yppi: 300 });
    expect(imgs[1]).toMatchObject({ width: px(SCAN.w, 600), height: px(SCAN.h, 600), color: 'gray', bpc: 1, enc: 'image', xppi: 600, yppi: 600 });
    expect(imgs[2]).toMatchObject({ width: px(SCAN.w, 300), height: px(SCAN.h, 300), color: 'gray', bpc: 8, xppi: 250, yppi: 250 });
    // pdfimages reads the same resolution the preflight computed from the fit, page by page.
    const pre = await callRoute(preflightRoute.GET, { as: 'viewer', params: { volumeId: v.id } });
    for (const [i, img] of imgs.entries()) {
      const page = pre.body.pages[i];
      expect(Math.round(page.ppi.x)).toBe(img.xppi);
      expect(Math.round(page.ppi.y)).toBe(img.yppi);
    }
    expect(imgs[3]).toMatchObject({ width: px(SCAN.w, 300), height: px(SCAN.h, 300), color: 'gray', bpc: 8, xppi: 300, yppi: 300 });

    // Placed upright where the fit says: rendered at 2 px a mm (50.8 dpi), the line page's bar (10–130 mm across,
    // 10–11 mm down the scan, which is the page from the bleed's corner) is dark at the top and nothing at the bottom;
    // the red square (40–50 mm) of page 4 prints as grey.
    const line2 = await renderPage(file, 2, 50.8, path.join(dir, 'p2'));
    expect(lum(rgbAt(line2, 140, 21))).toBeLessThan(80);
    expect(lum(rgbAt(line2, 140, line2.height - 22))).toBeGreaterThan(240);
    const red4 = await renderPage(file, 4, 50.8, path.join(dir, 'p4'));
    const [r, g, bl4] = rgbAt(red4, 90, 90);
    expect(r).toBe(g);
    expect(g).toBe(bl4);
    expect(r).toBeLessThan(160);
    expect(lum(rgbAt(red4, 90, 130))).toBeGreaterThan(240);

    const jobs = await callRoute(jobsRoute.GET, { as: 'viewer', params: { volumeId: v.id } });
    const printJob = jobs.body.jobs.find((j: { proof: boolean; kind: string }) => !j.proof && j.kind === 'print');
    expect(printJob).toMatchObject({ state: 'done', pages: 8, done: 8, total: 8 });
    expect(printJob.notes).toEqual(['Page 4: the scan is in colour; the print file has it in grey.']);
    // A saddle-stitched book has no cover file.
    expect((await callRouteRaw(coverRoute.GET, { as: 'owner', params: { volumeId: v.id } })).status).toBe(422);
  }, 180_000);

  it('the cover of a perfect-bound book: back, spine and front at the computed width, with the bleed', async () => {
    const db = env.db();
    const v = await perfectBound(db, 'Kettle Crab cover');
    const cover = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'cover' });
    for (let i = 0; i < 4; i++) await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'blank' });
    const back = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'back-cover' });
    expect((await callRouteRaw(coverRoute.GET, { as: 'owner', params: { volumeId: v.id } })).status).toBe(409);
    await matterScan(v.id, cover.id, await greyTiff({ ...SCAN, ppi: 300, tone: 120 }), 'front.tif', 'image/tiff');
    await matterScan(v.id, back.id, await greyTiff({ ...SCAN, ppi: 300, tone: 160 }), 'back.tif', 'image/tiff');
    const res = await callRouteRaw(coverRoute.GET, { as: 'owner', params: { volumeId: v.id } });
    expect(res.status).toBe(200);
    const file = await save(res, 'cover.pdf');
    const b = boxes(file);
    expect(b.pages).toBe(1);
    const spine = (6 / 2) * 0.12; // 6 pages ÷ 2 leaves × 0.12 mm caliper = 0.36 mm
    const width = ((2 * TRIM.w + spine + 2 * BLEED) / IN) * PT;
    const height = (SCAN.h / IN) * PT;
    const bl = (BLEED / IN) * PT;
    near(b.media[0]!, [0, 0, width, height]);
    near(b.bleed[0]!, [0, 0, width, height]);
    near(b.trim[0]!, [bl, bl, width - bl, height - bl]);
    const imgs = images(file);
    expect(imgs).toHaveLength(2);
    for (const i of imgs) expect(i).toMatchObject({ color: 'gray', bpc: 8, xppi: 300, yppi: 300 });
  }, 120_000);

  it('?proof=1 on print.pdf: the owner gets a proof with the newest pass standing in, marked in a slug outside the bleed; nobody else, and nothing else', async () => {
    const db = env.db();
    const v = await createVolume(db, {
      seriesId: DEMO_SERIES_ID,
      title: 'Pencil proof',
      deadline: '2027-03-13',
      spec: { ...SPEC, binding: 'saddle' },
    });
    const inked = await gagWithScan(await greyTiff({ ...SCAN, ppi: 300, tone: 220 }), 'inked.tif', 'image/tiff');
    await fitToBleed(inked.finalPageId);
    // Pass 1 draws its bar 40 mm down the trim, pass 2 (the newest) 70 mm down.
    const pencil = await gagInPencil('Pencil only', [40, 70]);
    for (const g of [inked, pencil]) await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: g.gagId });
    for (let i = 0; i < 2; i++) await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'blank' }); // 4 pages: no blanks added
    const url = (q: string) => `/api/volumes/${v.id}/export/print.pdf${q}`;

    // Without a proof: 409 naming the page in pencil; a co-creator asking for a proof: 403; a proof other than 0 or 1: 422.
    const refused = await callRoute(printRoute.GET, { url: url(''), as: 'owner', params: { volumeId: v.id } });
    expect(refused.status).toBe(409);
    expect(refused.body.missing).toEqual([{ number: 2, label: 'Pencil only' }]);
    expect(refused.body.error).toBe('Page 2 has no final page yet. Upload it, or ask for a proof.');
    const notOwner = await callRoute(printRoute.GET, { url: url('?proof=1'), as: 'cocreator', params: { volumeId: v.id } });
    expect(notOwner.status).toBe(403);
    expect(notOwner.body.error).toMatch(/Only the owner asks for a proof/);
    for (const q of ['?proof=2', '?proof=yes', '?proof=']) {
      const bad = await callRoute(printRoute.GET, { url: url(q), as: 'owner', params: { volumeId: v.id } });
      expect(bad.status, q).toBe(422);
      expect(bad.body.error).toMatch(/"proof" is 1/);
    }
    expect(await jobCount(v.id), 'refusals write no job').toBe(0);

    const res = await callRouteRaw(printRoute.GET, { url: url('?proof=1'), as: 'owner', params: { volumeId: v.id } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const file = await save(res, 'pencil-proof.pdf');
    const jobs = await db.selectFrom('printJobs').select(['kind', 'proof', 'state', 'pages']).where('volumeId', '=', v.id).execute();
    expect(jobs).toEqual([{ kind: 'print', proof: 1, state: 'done', pages: 4 }]);

    const b = boxes(file);
    expect(b.pages).toBe(4);
    // The scan is the only image (page 1); the pencil page is drawn from its pass, not from a picture.
    expect(images(file).map((i) => i.page)).toEqual([1]);
    const slugs = [`${PROOF_MARK} · page 1 · inked.tif · final`, `${PROOF_MARK} · page 2 · Pencil only · NOT FINAL: pass 2 stands in`];
    for (const [i, slug] of slugs.entries()) {
      const pageH = b.media[i]![3]!;
      const words = wordsOn(file, i + 1);
      // The page's only text is its slug, and every word of it lies outside the BleedBox, inside the MediaBox.
      expect(words.map((w) => w.text).join(' ')).toBe(slug);
      for (const w of words) {
        expect(overlaps(w, b.bleed[i]!, pageH), `"${w.text}" on page ${i + 1}`).toBe(false);
        expect(overlaps(w, b.media[i]!, pageH)).toBe(true);
      }
    }
    // The slug's font is embedded as a subset (ISO 32000-1 §9.6.4): named with a six-letter tag and '+', which is what
    // pdffonts reads as "sub", and holding only the glyphs the slugs use, not the whole font.
    const slugFonts = fonts(file);
    expect(slugFonts).toHaveLength(1);
    expect(slugFonts[0]).toMatch(/^[A-Z]{6}\+AtkinsonHyperlegible-Regular\s+CID TrueType\s+Identity-H\s+yes\s+yes\s+yes\s/);
    const whole = (fontkit.create(sfntFromWoff(fs.readFileSync('fonts/atkinson-hyperlegible-latin-400-normal.woff'))) as { numGlyphs: number })
      .numGlyphs;
    const [glyphs] = await embeddedGlyphCounts(file);
    expect(whole).toBeGreaterThan(200);
    expect(glyphs).toBeLessThan(60); // the slugs' distinct characters (and .notdef)
    // Pass 2's bar is drawn where it lies, pass 1's is not: rendered at 2 px a mm, the trim's corner is the slug and the bleed in.
    const img = await renderPage(file, 2, 50.8, path.join(dir, 'pencil-2'));
    const at = (mmAcross: number, mmDown: number) => rgbAt(img, Math.round((8 + BLEED + mmAcross) * 2), Math.round((8 + BLEED + mmDown) * 2));
    expect(lum(at(pencil.across, 70))).toBeLessThan(80);
    expect(lum(at(pencil.across, 40))).toBeGreaterThan(240);
  }, 120_000);

  it('a perfect-bound book of an odd page count gets one blank before the back matter, and a cover proof on ?proof=1', async () => {
    const db = env.db();
    const v = await perfectBound(db, 'Odd perfect');
    const grey = (tone: number) => greyTiff({ ...SCAN, ppi: 300, tone });
    const cover = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'cover' });
    const gags = [await gagWithScan(await grey(200), 'a.tif', 'image/tiff'), await gagWithScan(await grey(210), 'b.tif', 'image/tiff')];
    for (const g of gags) {
      await fitToBleed(g.finalPageId);
      await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: g.gagId });
    }
    const afterword = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'afterword' });
    const back = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'back-cover' });
    await matterScan(v.id, cover.id, await grey(120), 'cover.tif', 'image/tiff');
    await matterScan(v.id, afterword.id, await grey(230), 'afterword.tif', 'image/tiff');

    // The back cover has no scan yet: the cover file waits, except as the owner's proof.
    const url = (q: string) => `/api/volumes/${v.id}/export/cover.pdf${q}`;
    const refused = await callRoute(coverRoute.GET, { url: url(''), as: 'owner', params: { volumeId: v.id } });
    expect(refused.status).toBe(409);
    expect(refused.body.missing).toEqual([{ number: 5, label: 'Back cover' }]);
    expect((await callRoute(coverRoute.GET, { url: url('?proof=1'), as: 'cocreator', params: { volumeId: v.id } })).status).toBe(403);
    expect((await callRoute(coverRoute.GET, { url: url('?proof=2'), as: 'owner', params: { volumeId: v.id } })).status).toBe(422);
    expect(await jobCount(v.id)).toBe(0);
    const proofRes = await callRouteRaw(coverRoute.GET, { url: url('?proof=1'), as: 'owner', params: { volumeId: v.id } });
    expect(proofRes.status).toBe(200);
    const proof = await save(proofRes, 'odd-cover-proof.pdf');
    const pb = boxes(proof);
    expect(pb.pages).toBe(1);
    // The spine counts the added blank: 6 pages ÷ 2 × 0.12 mm = 0.36 mm.
    const words = wordsOn(proof, 1);
    expect(words.map((w) => w.text).join(' ')).toBe(`${PROOF_MARK} · cover · spine 0.36 mm`);
    for (const w of words) expect(overlaps(w, pb.bleed[0]!, pb.media[0]![3]!), w.text).toBe(false);
    expect(images(proof)).toHaveLength(1); // the front only: nothing stands in for a cover's scan

    await matterScan(v.id, back.id, await grey(160), 'back.tif', 'image/tiff');
    const res = await callRouteRaw(printRoute.GET, { as: 'editor', params: { volumeId: v.id } });
    expect(res.status).toBe(200);
    const file = await save(res, 'odd-perfect.pdf');
    // pdfinfo: 5 pages in the running order, 6 in the file — perfect binding takes an even count (one blank, not three as for saddle stitch).
    const b = boxes(file);
    expect(b.pages).toBe(6);
    expect(b.trim).toHaveLength(6);
    const w = (SCAN.w / IN) * PT;
    const h = (SCAN.h / IN) * PT;
    for (let i = 0; i < 6; i++) near(b.bleed[i]!, [0, 0, w, h]);
    // The blank goes after the last gag, before the afterword and back cover: page 4 has no image.
    expect(images(file).map((i) => i.page)).toEqual([1, 2, 3, 5, 6]);
    const pre = await callRoute(preflightRoute.GET, { as: 'viewer', params: { volumeId: v.id } });
    expect(pre.body.book).toMatchObject({ pages: 5, binding: 'perfect', blanksToAdd: 1, blanksAfter: 3 });
  }, 120_000);

  it('a job whose server stopped reads as failed on every instance', async () => {
    const db = env.db();
    const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Lost job', deadline: '2027-03-13' });
    const id = randomUUID();
    await db
      .insertInto('printJobs')
      .values({
        id,
        volumeId: v.id,
        kind: 'print',
        state: 'running',
        requestedBy: PERSONAS.owner.id,
        createdAt: new Date().toISOString(),
        heartbeatAt: Date.now() - 61_000,
      })
      .execute();
    const r = await callRoute(jobRoute.GET, { as: 'viewer', params: { jobId: id } });
    expect(r.body.job).toMatchObject({ state: 'failed', message: expect.stringMatching(/stopped before it finished/) });
    expect((await callRouteRaw(jobFileRoute.GET, { as: 'viewer', params: { jobId: id } })).status).toBe(409);
  });

  it('keeps the newest three files of a kind: an older one leaves storage, its job stays listed without a file, and its download says so (410)', async () => {
    const db = env.db();
    const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Many builds', deadline: '2027-03-13' });
    // Five print files built one after another, and one proof (a kind of its own, kept apart).
    const jobs: { id: string; key: string; proof: boolean }[] = [];
    for (let i = 0; i < 6; i++) {
      const proof = i === 0;
      const id = randomUUID();
      const key = `print-jobs/${id}.pdf`;
      await putObject(key, Buffer.from(`%PDF-1.7 build ${i}`), 'application/pdf');
      await db
        .insertInto('printJobs')
        .values({
          id,
          volumeId: v.id,
          kind: 'print',
          proof: proof ? 1 : 0,
          state: 'done',
          stage: 'Ready',
          objectKey: key,
          pages: 1,
          bytes: 20,
          requestedBy: PERSONAS.owner.id,
          createdAt: new Date(Date.UTC(2027, 0, 1, 10, i)).toISOString(),
          finishedAt: new Date(Date.UTC(2027, 0, 1, 10, i, 30)).toISOString(),
          heartbeatAt: Date.now(),
        })
        .execute();
      jobs.push({ id, key, proof });
    }
    const newest = jobs.at(-1)!;
    await retireOldFiles(db, (await findPrintJob(db, newest.id))!);

    const prints = jobs.filter((j) => !j.proof);
    const [older, kept] = [prints.slice(0, 2), [...prints.slice(2), jobs[0]!]];
    for (const j of older) {
      expect(await getObjectStream(j.key), 'an older file leaves storage').toBeNull();
      const r = await callRoute(jobRoute.GET, { as: 'viewer', params: { jobId: j.id } });
      expect(r.body.job).toMatchObject({ state: 'done', file: null, stage: 'Replaced by a newer file' });
      const file = await callRouteRaw(jobFileRoute.GET, { as: 'viewer', params: { jobId: j.id } });
      expect(file.status).toBe(410);
      expect(((await file.json()) as { error: string }).error).toMatch(/replaced by a newer one/);
    }
    for (const j of kept) {
      expect(await getObjectStream(j.key), 'a kept file stays').not.toBeNull();
      const file = await callRouteRaw(jobFileRoute.GET, { as: 'viewer', params: { jobId: j.id } });
      expect(file.status).toBe(200);
      expect(Buffer.from(await file.arrayBuffer()).toString()).toMatch(/^%PDF-1\.7 build/);
    }
    // Nothing more to retire: a second pass changes nothing.
    expect(await retireOldPrintFiles(db, { volumeId: v.id, kind: 'print', proof: false })).toEqual([]);
  });
});
