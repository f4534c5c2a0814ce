// What the print check found on the review dummy and the flatplan, read back with poppler:
// `pdftotext -bbox` gives each word's box (pt, from the page's top left, the font's ascent to
// its descent), `pdfinfo -box` the page boxes. The page number must sit inside the safe area,
// the slug (page name and printer note) wholly in the bleed outside the trim — whatever the bleed.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Kysely } from 'kysely';
import { beforeAll, describe, expect, it } from 'vitest';
import * as reviewRoute from '@/app/api/volumes/[volumeId]/export/review.pdf/route';
import * as flatplanRoute from '@/app/api/volumes/[volumeId]/flatplan/route';
import type { Database } from '@/db/database';
import { addEntry, createVolume } from '@/db/queries/volumes';
import { pdfBoxes } from '@/lib/print/book';
import { callRoute, callRouteRaw } from '../support/call-route';
import { DEMO_SERIES_ID, freshDb } from '../support/test-db';

let db: Kysely<Database>;
beforeAll(async () => {
  db = await freshDb();
});

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-marks-'));

type Word = { page: number; text: string; xMin: number; yMin: number; xMax: number; yMax: number };
function words(file: string): { pageH: number[]; words: Word[] } {
  const html = execFileSync('pdftotext', ['-bbox', file, '-'], { encoding: 'utf8' });
  const pageH: number[] = [];
  const out: Word[] = [];
  for (const [i, page] of html.split('<page ').slice(1).entries()) {
    pageH.push(Number(page.match(/height="([\d.]+)"/)![1]));
    for (const m of page.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g)) {
      const text = m[5]!
        .replace(/&apos;/g, "'")
        .replace(/&quot;/g, '"')
        .replace(/&lt;/g, '<')
        .replace(/&gt;/g, '>')
        .replace(/&amp;/g, '&');
      out.push({ page: i + 1, text, xMin: Number(m[1]), yMin: Number(m[2]), xMax: Number(m[3]), yMax: Number(m[4]) });
    }
  }
  return { pageH, words: out };
}

/** A volume of two matter pages (no art, so the only words are the marks) at this bleed. */
async function reviewAt(bleed: number, safe = 5) {
  const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: `Bleed ${bleed}`, deadline: '2027-03-13', spec: { bleed, safe } });
  await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'title' });
  await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'credits' });
  const res = await callRouteRaw(reviewRoute.GET, { as: 'viewer', params: { volumeId: v.id } });
  expect(res.status).toBe(200);
  const file = path.join(dir, `bleed-${bleed}.pdf`);
  fs.writeFileSync(file, Buffer.from(await res.arrayBuffer()));
  return { file, boxes: pdfBoxes({ trimW: 150, trimH: 150, bleed, safe, gutter: 4 }) };
}

describe('review dummy marks', () => {
  for (const bleed of [3, 2, 1.5, 1, 0]) {
    it(`bleed ${bleed} mm: the page number lies inside the safe area; the slug lies in the bleed below the trim or is left off`, async () => {
      const { file, boxes } = await reviewAt(bleed);
      const { pageH, words: all } = words(file);
      // pdftotext measures from the top: a PDF y (from the bottom) is pageH − y.
      const H = pageH[0]!;
      const [sx0, sy0, sx1, sy1] = boxes.safe;
      const trimBottomFromTop = H - boxes.trim[1];
      for (const n of [1, 2]) {
        const number = all.find((w) => w.page === n && w.text === String(n) && w.yMin > H / 2);
        expect(number, `page ${n}'s number`).toBeDefined();
        // Inside the safe box (ISO 32000-1 §14.11.2 boxes; the 5 mm safe margin is common practice).
        expect(number!.xMin).toBeGreaterThanOrEqual(sx0);
        expect(number!.xMax).toBeLessThanOrEqual(sx1);
        expect(number!.yMax).toBeLessThanOrEqual(H - sy0 + 0.01);
        expect(number!.yMin).toBeGreaterThanOrEqual(H - sy1);
        const slug = all.filter((w) => w.page === n && w.text !== String(n) && !['Title', 'page', 'Credits'].includes(w.text));
        if (bleed >= 1.5) {
          expect(slug.map((w) => w.text).join(' ')).toContain("Guidance only: the printer's own specification takes precedence.");
          // Every glyph box below the trim's bottom edge, and on the page.
          for (const w of slug) {
            expect(w.yMin, w.text).toBeGreaterThan(trimBottomFromTop);
            expect(w.yMax, w.text).toBeLessThanOrEqual(H);
          }
        } else {
          expect(slug.map((w) => w.text)).toEqual([]); // too narrow for 2 pt text: off the page, kept in the Subject
        }
      }
      expect(execFileSync('pdfinfo', [file], { encoding: 'utf8' })).toMatch(/Subject:\s+Guidance only: the printer's own specification/);
    });
  }
});

describe('flatplan figures', () => {
  it('a saddle-stitched book has no spine; a perfect-bound one has pages ÷ 2 × caliper', async () => {
    const saddle = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Saddle', deadline: '2027-03-13', spec: { binding: 'saddle' } });
    const perfect = await createVolume(db, {
      seriesId: DEMO_SERIES_ID,
      title: 'Perfect',
      deadline: '2027-03-13',
      spec: { binding: 'perfect', caliperUm: 120 },
    });
    for (const v of [saddle, perfect]) for (let i = 0; i < 8; i++) await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'blank' });
    const s = await callRoute(flatplanRoute.GET, { as: 'viewer', params: { volumeId: saddle.id } });
    expect(s.body.spineMm).toBeNull();
    const p = await callRoute(flatplanRoute.GET, { as: 'viewer', params: { volumeId: perfect.id } });
    expect(p.body.spineMm).toBeCloseTo((8 / 2) * 0.12, 10); // 0.48 mm
  });
  it('printer spreads of a right-to-left book are the left-to-right pairs mirrored', async () => {
    const ltr = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'LTR', deadline: '2027-03-13' });
    const rtl = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'RTL', deadline: '2027-03-13', spec: { direction: 'rtl' } });
    for (const v of [ltr, rtl]) for (let i = 0; i < 8; i++) await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'blank' });
    const a = (await callRoute(flatplanRoute.GET, { as: 'viewer', params: { volumeId: ltr.id } })).body;
    const b = (await callRoute(flatplanRoute.GET, { as: 'viewer', params: { volumeId: rtl.id } })).body;
    expect(a.printerSpreads).toEqual([
      [8, 1],
      [2, 7],
      [6, 3],
      [4, 5],
    ]);
    expect(b.printerSpreads).toEqual(a.printerSpreads.map(([l, r]: [number, number]) => [r, l]));
    // The reader spreads agree: page 1 is on the left of its spread in a right-to-left book.
    expect(b.spreads[0]).toEqual([1, null]);
  });
});
