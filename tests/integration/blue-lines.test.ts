// Blue-line sheets for the drawing desk, read back with poppler: pdfinfo (pages, sizes),
// pdftotext (titles, notes) and pdftoppm (the pixels): the approved pass's strokes in light
// blue where the sheet's own 10 mm scale bar says they belong, and nothing on a gag not ready.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Kysely } from 'kysely';
import { beforeAll, describe, expect, it } from 'vitest';
import * as offerRoute from '@/app/api/volumes/[volumeId]/export/templates/route';
import * as sheetsRoute from '@/app/api/volumes/[volumeId]/export/templates.pdf/route';
import * as entriesRoute from '@/app/api/volumes/[volumeId]/entries/route';
import type { Database } from '@/db/database';
import { passState } from '@/db/queries/passes';
import { approvedPasses } from '@/db/queries/stamps';
import { DEMO_VOLUME_ID, PASSES_BY_STATUS } from '@/db/seed/demo-data';
import { DEFAULT_PAGE_SPEC, type Rect, panelRects } from '@/lib/print/geometry';
import { TILE_EDGE, sheetCanvas, tiling } from '@/lib/print/sheets';
import { outlineOf } from '@/lib/strokes/outline';
import { callRoute, callRouteRaw } from '../support/call-route';
import { type Image, type Placement, coveredPixels, lum, renderPage, rgbAt } from '../support/pixels';
import { freshDb } from '../support/test-db';

let db: Kysely<Database>;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-blue-'));
const READY = 'demo-gag-05'; // "Moving Day", ready to ink, page 7
const NOT_READY = 'demo-gag-07'; // in review, no stamp; placed as page 10 below

beforeAll(async () => {
  db = await freshDb();
  const placed = await callRoute(entriesRoute.POST, {
    method: 'POST',
    as: 'owner',
    params: { volumeId: DEMO_VOLUME_ID },
    body: { gagId: NOT_READY },
  });
  expect(placed.status).toBe(201);
});

async function sheets(query: string, name: string) {
  const res = await callRouteRaw(sheetsRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID }, url: `/x?${query}` });
  expect(res.status, await res.clone().text()).toBe(200);
  const file = path.join(dir, name);
  fs.writeFileSync(file, Buffer.from(await res.arrayBuffer()));
  return file;
}

const pdfPages = (file: string) => Number(execFileSync('pdfinfo', [file], { encoding: 'utf8' }).match(/^Pages:\s+(\d+)/m)![1]);
const pageSize = (file: string) =>
  execFileSync('pdfinfo', [file], { encoding: 'utf8' })
    .match(/^Page size:\s+([\d.]+) x ([\d.]+)/m)!
    .slice(1)
    .map(Number);
const textOf = (file: string, page: number) =>
  execFileSync('pdftotext', ['-f', String(page), '-l', String(page), '-layout', file, '-'], { encoding: 'utf8' });

describe('what the export offers', () => {
  it('only sizes that fit one sheet, or tiled ones with their sheet count; the gags in running order, the ready ones chosen', async () => {
    const r = await callRoute(offerRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    expect(r.status).toBe(200);
    // 150 mm + 2 × 3 mm bleed at 200 % is 312 mm: wider than A3's 297 mm (ISO 216), so 200 % is offered only tiled.
    expect(r.body.sizes).toEqual([
      { scale: 100, paper: 'A4', tiled: false, sheetsPerPage: 1 },
      { scale: 100, paper: 'A3', tiled: false, sheetsPerPage: 1 },
      { scale: 150, paper: 'A4', tiled: true, sheetsPerPage: 2 },
      { scale: 150, paper: 'A3', tiled: false, sheetsPerPage: 1 },
      { scale: 200, paper: 'A4', tiled: true, sheetsPerPage: 4 },
      { scale: 200, paper: 'A3', tiled: true, sheetsPerPage: 2 },
    ]);
    const gags = r.body.gags as { gagId: string; page: number; approved: { passNumber: number } | null }[];
    expect(gags.map((g) => [g.gagId, g.page])).toEqual([
      ['demo-gag-01', 3],
      ['demo-gag-02', 4],
      ['demo-gag-03', 5],
      ['demo-gag-04', 6],
      ['demo-gag-05', 7],
      ['demo-gag-06', 8],
      [NOT_READY, 10],
    ]);
    // The demo stamps each stamped gag's last pass.
    expect(gags.find((g) => g.gagId === READY)!.approved!.passNumber).toBe(PASSES_BY_STATUS.ready_to_ink);
    expect(gags.find((g) => g.gagId === NOT_READY)!.approved).toBeNull();
    expect(r.body.defaults).toEqual(gags.filter((g) => g.approved).map((g) => g.gagId));
    expect(r.body.defaults).not.toContain(NOT_READY);
  });

  it('by default one sheet per gag with a standing "ready to ink" stamp', async () => {
    const file = await sheets('scale=100&paper=A4', 'default.pdf');
    expect(pdfPages(file)).toBe(6);
    expect(textOf(file, 1)).toMatch(/3\. Low Tide Lunch/);
  });

  it('a size that does not fit is refused unless tiled, and says how many sheets tiling takes; bad input is refused', async () => {
    const call = (q: string) => callRoute(sheetsRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: `/x?${q}` });
    const refused = await call('scale=200&paper=A3');
    expect(refused.status).toBe(422);
    expect(refused.body.error).toMatch(/does not fit on A3: .*tile it across 2 sheets a page/);
    for (const q of ['scale=120', 'paper=A5', 'guide=red', 'strength=5', 'strength=abc', 'tile=yes', `gags=${READY},nobody`, 'gags=<x>']) {
      const r = await call(q);
      expect(r.status, q).toBe(422);
      expect(r.body.error, q).toBeTruthy();
    }
  });
});

/** The 10 mm scale bar: the one filled dark block under the page (its first rows: left, width in px, top). */
function findBar(img: Image) {
  const dark = (x: number, y: number) => lum(rgbAt(img, x, y)) < 110;
  for (let y = Math.floor(img.height / 3); y < img.height - 4; y++) {
    for (let x = 0; x < img.width; x++) {
      if (!dark(x, y)) continue;
      let run = 0;
      while (x + run < img.width && dark(x + run, y)) run++;
      // A block: a run of 20 px or more that is as long four rows further down (text and lines are not).
      let below = 0;
      while (below < run && dark(x + below, y + 4)) below++;
      if (run >= 20 && Math.abs(below - run) <= 2) return { left: x, width: run, top: y };
      x += run;
    }
  }
  throw new Error('no scale bar found');
}

/**
 * The bar measured finely: rendered again at 1,200 dpi around where it was found, its row's
 * ink summed in units of the bar's own darkness. Returns its left edge (in pixels of `dpi`)
 * and its length in mm of paper.
 */
async function measureBar(file: string, page: number, dpi: number, rough: { left: number; width: number; top: number }, base: string) {
  const f = 1200 / dpi;
  const crop = { x: Math.floor((rough.left - 4) * f), y: Math.floor(rough.top * f), w: Math.ceil((rough.width + 8) * f), h: Math.ceil(4 * f) };
  const fine = await renderPage(file, page, 1200, base, crop);
  const row = Math.floor(fine.height / 2);
  const ink = lum(rgbAt(fine, Math.floor(fine.width / 2), row));
  const cover = (x: number) => Math.max(0, Math.min(1, (255 - lum(rgbAt(fine, x, row))) / (255 - ink)));
  let width = 0;
  let first = -1;
  for (let x = 0; x < fine.width; x++) {
    width += cover(x);
    if (first < 0 && cover(x) > 0.02) first = x;
  }
  const left = first + 1 - cover(first);
  return { left: (crop.x + left) / f, mm: (width / 1200) * 25.4 };
}

/** The trim's top edge: the first neutral dark line down the middle of the page (the bleed line above it is red). */
function findTrimTop(img: Image, x: number, fromY: number) {
  for (let y = fromY; y < img.height; y++) {
    const c = rgbAt(img, x, y);
    if (lum(c) < 200 && Math.abs(c[0] - c[2]) < 30) {
      let sum = 0;
      let weight = 0;
      for (let yy = y; yy < y + 4; yy++) {
        const d = 255 - lum(rgbAt(img, x, yy));
        sum += d * (yy + 0.5);
        weight += d;
      }
      return sum / weight;
    }
  }
  throw new Error('no trim line found');
}

/**
 * The guide blue, at any strength: white less some of (91, 34, 18), #A4DDED's distance from
 * white, so red loses most and blue least. The dark blue of the safe line (lost in the ratio
 * 227 : 176 : 145) and the red bleed line do not pass, however faint their edges.
 */
const isGuideBlue = ([r, g, b]: [number, number, number]) => {
  const [dr, dg, db] = [255 - r, 255 - g, 255 - b];
  return dr >= 15 && dg / dr < 0.55 && db / dr < 0.4;
};
/** A pixel and those around it, to stay a pixel or two inside an outline. */
const CORE: [number, number][] = [
  [0, 0],
  [-2, 0],
  [2, 0],
  [0, -2],
  [0, 2],
  [-1, -1],
  [1, 1],
  [-1, 1],
  [1, -1],
];
const inRect = (r: Rect, x: number, y: number, inset: number) =>
  x >= r.x + inset && x <= r.x + r.w - inset && y >= r.y + inset && y <= r.y + r.h - inset;

describe('a sheet rendered with pdftoppm', () => {
  const DPI = 200;
  const SCALE = 1.5;

  /**
   * Where the book page lies on the rendered sheet, from the sheet itself: the bar must be
   * 10 mm of the book at the sheet's scale (within 0.05 mm of paper), its left end is the
   * trim's left edge, and the trim line gives the top. 1 in = 25.4 mm.
   */
  async function placeBook(file: string, img: Image, scale: number, name: string) {
    const bar = await measureBar(file, 1, DPI, findBar(img), path.join(dir, `${name}-bar`));
    expect(Math.abs(bar.mm - 10 * scale), `the bar is ${bar.mm} mm of paper`).toBeLessThan(0.05);
    const k = (scale * DPI) / 25.4; // px per mm of the book
    const at: Placement = { x0: bar.left, k, y0: findTrimTop(img, Math.round(bar.left + 75 * k), Math.floor(img.height / 20)) };
    return { at };
  }

  it("the approved pass's strokes in light blue, where the 10 mm bar puts them; no guide at all on a gag not ready", async () => {
    // Asked in the wrong order: the sheets come in running order (page 7, then page 10).
    const file = await sheets(`scale=150&paper=A3&gags=${NOT_READY},${READY}`, 'two.pdf');
    expect(pdfPages(file)).toBe(2);
    // ISO 216 A3 portrait: 297 × 420 mm = 841.89 × 1190.55 pt.
    const [w, h] = pageSize(file);
    expect(w).toBeCloseTo(841.89, 1);
    expect(h).toBeCloseTo(1190.55, 1);
    const first = textOf(file, 1);
    expect(first).toMatch(/7\. Moving Day/);
    expect(first).toMatch(/pass 3, approved to ink/);
    expect(first).toMatch(/1 Setup: A big spiral shell washes up, gleaming\./);
    expect(first).toMatch(/4 Payoff: Back in the teapot/);
    expect(first).toMatch(/10 mm at 150 %/);
    expect(textOf(file, 2)).toMatch(/not ready to ink/);

    const img = await renderPage(file, 1, DPI, path.join(dir, 'ready'));
    const { at } = await placeBook(file, img, SCALE, 'ready');
    const { k } = at;

    const approved = (await approvedPasses(db, [READY])).get(READY)!;
    const state = (await passState(db, approved.passId))!;
    const panels = panelRects(DEFAULT_PAGE_SPEC);
    const near = new Set<number>();
    let checked = 0;
    for (const s of state.strokes) {
      const cover = coveredPixels(outlineOf(s), at, img, 4);
      const deep: [number, number, number][] = [];
      for (let y = cover.py0; y <= cover.py1; y++) {
        for (let x = cover.px0; x <= cover.px1; x++) {
          let all = cover.inside(x, y);
          let any = all;
          for (let dy = -3; dy <= 3; dy++) {
            for (let dx = -3; dx <= 3; dx++) {
              const d = Math.abs(dx) + Math.abs(dy);
              const inside = cover.inside(x + dx, y + dy);
              if (d <= 2) all &&= inside;
              any ||= inside;
            }
          }
          if (any) near.add(y * img.width + x);
          if (all && inRect(panels[s.panel]!, (x + 0.5 - at.x0) / k, (y + 0.5 - at.y0) / k, 0.3)) deep.push(rgbAt(img, x, y));
        }
      }
      if (s.tool !== 'pen' || s.grey < 80 || deep.length < 3) continue;
      checked++;
      const blue = deep.filter(isGuideBlue);
      expect(blue.length / deep.length, `stroke ${s.id}`).toBeGreaterThan(0.8);
    }
    expect(checked).toBeGreaterThan(20);
    // Every light-blue pixel in the panels belongs to a stroke or to a balloon room's dashed outline.
    const nearRoom = (x: number, y: number) =>
      state.rooms.some((r) => {
        const q = Math.hypot((x - r.x - r.w / 2) / (r.w / 2), (y - r.y - r.h / 2) / (r.h / 2));
        return r.shape === 'ellipse'
          ? (Math.abs(q - 1) * Math.min(r.w, r.h)) / 2 < 0.6
          : inRect({ x: r.x - 0.6, y: r.y - 0.6, w: r.w + 1.2, h: r.h + 1.2 }, x, y, 0);
      });
    const stray: string[] = [];
    let blueSeen = 0;
    for (const r of panels) {
      for (let y = Math.ceil(at.y0 + (r.y + 0.5) * k); y < at.y0 + (r.y + r.h - 0.5) * k; y++) {
        for (let x = Math.ceil(at.x0 + (r.x + 0.5) * k); x < at.x0 + (r.x + r.w - 0.5) * k; x++) {
          if (!isGuideBlue(rgbAt(img, x, y))) continue;
          blueSeen++;
          const mx = (x + 0.5 - at.x0) / k;
          const my = (y + 0.5 - at.y0) / k;
          if (!near.has(y * img.width + x) && !nearRoom(mx, my)) stray.push(`(${mx.toFixed(1)}, ${my.toFixed(1)}) mm`);
        }
      }
    }
    expect(blueSeen).toBeGreaterThan(5000);
    expect(stray.slice(0, 5)).toEqual([]);

    // The gag not ready: its panels are blank paper, not a single blue pixel.
    const blank = await renderPage(file, 2, DPI, path.join(dir, 'not-ready'));
    let blueThere = 0;
    let looked = 0;
    for (const r of panels) {
      for (let y = Math.ceil(at.y0 + (r.y + 0.5) * k); y < at.y0 + (r.y + r.h - 0.5) * k; y++) {
        for (let x = Math.ceil(at.x0 + (r.x + 0.5) * k); x < at.x0 + (r.x + r.w - 0.5) * k; x++) {
          looked++;
          if (isGuideBlue(rgbAt(blank, x, y)) || lum(rgbAt(blank, x, y)) < 200) blueThere++;
        }
      }
    }
    expect(looked).toBeGreaterThan(4 * 500 * 500);
    // Only the panel's own label ("1 Setup"…) is ink in there.
    expect(blueThere / looked).toBeLessThan(0.002);
    let anyBlue = 0;
    for (let y = 0; y < blank.height; y++) for (let x = 0; x < blank.width; x++) if (isGuideBlue(rgbAt(blank, x, y))) anyBlue++;
    expect(anyBlue).toBe(0);
  });

  it('grey guides on request, and strength makes them fainter', async () => {
    const mean = async (query: string, name: string) => {
      const file = await sheets(`scale=100&paper=A4&gags=${READY}&${query}`, `${name}.pdf`);
      const img = await renderPage(file, 1, DPI, path.join(dir, name));
      const { at } = await placeBook(file, img, 1, name);
      const approved = (await approvedPasses(db, [READY])).get(READY)!;
      const strokes = (await passState(db, approved.passId))!.strokes.filter((s) => s.tool === 'pen' && s.grey === 100);
      const sum = [0, 0, 0];
      let n = 0;
      for (const s of strokes) {
        const cover = coveredPixels(outlineOf(s), at, img, 3);
        for (let y = cover.py0 + 2; y <= cover.py1 - 2; y++) {
          for (let x = cover.px0 + 2; x <= cover.px1 - 2; x++) {
            let all = true;
            for (const [dx, dy] of CORE) all &&= cover.inside(x + dx, y + dy);
            if (!all) continue;
            rgbAt(img, x, y).forEach((v, i) => (sum[i] = sum[i]! + v));
            n++;
          }
        }
      }
      expect(n).toBeGreaterThan(500);
      return sum.map((v) => v / n);
    };
    // Full strength: the non-photo blue #A4DDED = (164, 221, 237) itself (common practice, from memory).
    const blue = await mean('guide=blue&strength=100', 'blue-100');
    [164, 221, 237].forEach((v, i) => expect(Math.abs(blue[i]! - v), `channel ${i}`).toBeLessThan(10));
    // Grey at 50 %: 0.62 grey mixed half with white, 1 − 0.38 × 0.5 = 0.81 → 206.6 of 255, neutral.
    const grey = await mean('guide=grey&strength=50', 'grey-50');
    for (const v of grey) expect(Math.abs(v - 206.6)).toBeLessThan(10);
    expect(Math.abs(grey[0]! - grey[2]!)).toBeLessThan(3);
    const fainter = await mean('guide=blue&strength=40', 'blue-40');
    expect(lum(fainter as [number, number, number])).toBeGreaterThan(lum(blue as [number, number, number]) + 15);
  });

  it('tiled: 200 % on A3 is two sheets a page, each with its part of the guides and the same overlap marks', async () => {
    const file = await sheets(`scale=200&paper=A3&tile=1&gags=${READY}`, 'tiled.pdf');
    expect(pdfPages(file)).toBe(2);
    const c = sheetCanvas(DEFAULT_PAGE_SPEC, 2);
    const t = tiling(c, 'A3');
    expect([t.cols, t.rows, t.landscape]).toEqual([2, 1, false]);
    const dpi = 100;
    const px = (mm: number) => (mm * dpi) / 25.4;
    for (const [i, tile] of t.tiles.entries()) {
      const img = await renderPage(file, i + 1, dpi, path.join(dir, `tile-${i}`));
      let blue = 0;
      for (let y = 0; y < img.height; y++) for (let x = 0; x < img.width; x++) if (isGuideBlue(rgbAt(img, x, y))) blue++;
      expect(blue, `tile ${i + 1}`).toBeGreaterThan(500);
      // The crosses on the seam: canvas (seam, tile.y + ¼ and ¾ of the window) lands at the same place of the drawing on both sheets.
      for (const f of [0.25, 0.75]) {
        const cx = Math.round(px(TILE_EDGE + t.seamsX[0]! - tile.x));
        const cy = Math.round(px(TILE_EDGE + tile.y + f * t.window.h - tile.y));
        // The cross's arms: dark along a row and a column through its centre, 2.5 mm each way.
        const arm = Math.round(px(2));
        const darkRow = [-arm, arm].every(
          (d) => lum(rgbAt(img, cx + d, cy)) < 160 || lum(rgbAt(img, cx + d, cy + 1)) < 160 || lum(rgbAt(img, cx + d, cy - 1)) < 160,
        );
        const darkCol = [-arm, arm].every(
          (d) => lum(rgbAt(img, cx, cy + d)) < 160 || lum(rgbAt(img, cx + 1, cy + d)) < 160 || lum(rgbAt(img, cx - 1, cy + d)) < 160,
        );
        expect(darkRow && darkCol, `cross at ${f} on sheet ${i + 1}`).toBe(true);
      }
    }
  });
});
