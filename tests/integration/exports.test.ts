// Exports checked with poppler (Debian's poppler-utils): pdfinfo -box and pdffonts, and pages
// rendered with pdftoppm to see that every stroke is drawn where it lies and nothing elsewhere.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import fontkit from '@pdf-lib/fontkit';
import type { Kysely } from 'kysely';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import * as csvRoute from '@/app/api/volumes/[volumeId]/export/running-order.csv/route';
import * as reviewRoute from '@/app/api/volumes/[volumeId]/export/review.pdf/route';
import * as templatesRoute from '@/app/api/volumes/[volumeId]/export/templates.pdf/route';
import type { Database } from '@/db/database';
import { findVolume } from '@/db/queries/volumes';
import { DEMO_VOLUME_ID } from '@/db/seed/demo-data';
import { PRINTER_NOTE } from '@/lib/export/pdf';
import { volumePages } from '@/lib/export/volume-export';
import { sfntFromWoff } from '@/lib/export/woff';
import { pdfBoxes } from '@/lib/print/book';
import { type Rect, panelRects } from '@/lib/print/geometry';
import { type Outline, outlineOf } from '@/lib/strokes/outline';
import { callRouteRaw } from '../support/call-route';
import { pdfBoxesOf as boxes } from '../support/poppler';
import { freshDb } from '../support/test-db';

let db: Kysely<Database>;
beforeAll(async () => {
  db = await freshDb();
});

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-pdf-'));
async function save(res: Response, name: string) {
  const file = path.join(dir, name);
  fs.writeFileSync(file, Buffer.from(await res.arrayBuffer()));
  return file;
}

describe('review dummy PDF', () => {
  it('one page per running-order entry, TrimBox and BleedBox equal to the spec within 0.01 pt, fonts embedded', async () => {
    const res = await callRouteRaw(reviewRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const file = await save(res, 'review.pdf');
    const b = boxes(file);
    expect(b.pages).toBe(9); // the demo running order: cover, title, six gags, afterword
    // 150 mm trim with 3 mm bleed; 1 pt = 1/72 in, 1 in = 25.4 mm.
    const want = pdfBoxes({ trimW: 150, trimH: 150, bleed: 3, safe: 5, gutter: 4 });
    expect(b.trim).toHaveLength(9);
    for (const t of b.trim) t.forEach((v, i) => expect(Math.abs(v - want.trim[i]!)).toBeLessThanOrEqual(0.01));
    for (const t of b.bleed) t.forEach((v, i) => expect(Math.abs(v - want.bleed[i]!)).toBeLessThanOrEqual(0.01));
    expect(want.trim[2] - want.trim[0]).toBeCloseTo(425.197, 3);
    const fonts = execFileSync('pdffonts', [file], { encoding: 'utf8' }).trim().split('\n').slice(2);
    expect(fonts.length).toBeGreaterThan(0);
    // Columns end with: emb sub uni object-id generation. Every font must be embedded.
    for (const line of fonts) expect(line.match(/\s(yes|no)\s+(yes|no)\s+(yes|no)\s+\d+\s+\d+$/)![1]).toBe('yes');
    const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
    expect(info).toMatch(/Subject:\s+Guidance only: the printer's own specification takes precedence\./);
  });
});

/** Pixel centres in mm ↔ pixels, for a render of the bleed box at `dpi`. */
type Grid = { width: number; height: number; mmPerPx: number; bleed: number };
const centre = (g: Grid, p: number) => (p + 0.5) * g.mmPerPx - g.bleed;
const pixelOf = (g: Grid, mm: number) => Math.floor((mm + g.bleed) / g.mmPerPx);

/**
 * An outline's polygons over the pixels around them (their bounds and `reach` mm more): which
 * pixel centres they fill together (nonzero winding, as PDF's `f`, by scanlines) and how far
 * each is from its nearest edge (up to `reach`, by visiting the pixels beside each edge).
 */
function coverage(g: Grid, outline: Outline, reach: number) {
  const all = outline.flat();
  const x0 = Math.max(0, pixelOf(g, Math.min(...all.map((q) => q[0])) - reach));
  const x1 = Math.min(g.width - 1, pixelOf(g, Math.max(...all.map((q) => q[0])) + reach));
  const y0 = Math.max(0, pixelOf(g, Math.min(...all.map((q) => q[1])) - reach));
  const y1 = Math.min(g.height - 1, pixelOf(g, Math.max(...all.map((q) => q[1])) + reach));
  const w = x1 - x0 + 1;
  const h = Math.max(0, y1 - y0 + 1);
  const inside = new Uint8Array(w * h);
  const dist = new Float32Array(w * h).fill(reach);
  const edges = outline.flatMap((poly) => poly.map((a, i) => [a, poly[(i + 1) % poly.length]!] as const));
  for (let py = y0; py <= y1; py++) {
    const y = centre(g, py);
    const crossings: [number, number][] = [];
    for (const [[ax, ay], [bx, by]] of edges) {
      if ((ay <= y && by > y) || (by <= y && ay > y)) crossings.push([ax + ((y - ay) * (bx - ax)) / (by - ay), by > ay ? 1 : -1]);
    }
    crossings.sort((a, b) => a[0] - b[0]);
    let turn = 0;
    let k = 0;
    for (let px = x0; px <= x1; px++) {
      const x = centre(g, px);
      while (k < crossings.length && crossings[k]![0] < x) turn += crossings[k++]![1];
      if (turn !== 0) inside[(py - y0) * w + px - x0] = 1;
    }
  }
  for (const [[ax, ay], [bx, by]] of edges) {
    const dx = bx - ax;
    const dy = by - ay;
    const len2 = dx * dx + dy * dy;
    for (let py = Math.max(y0, pixelOf(g, Math.min(ay, by) - reach)); py <= Math.min(y1, pixelOf(g, Math.max(ay, by) + reach)); py++) {
      for (let px = Math.max(x0, pixelOf(g, Math.min(ax, bx) - reach)); px <= Math.min(x1, pixelOf(g, Math.max(ax, bx) + reach)); px++) {
        const x = centre(g, px);
        const y = centre(g, py);
        const t = len2 ? Math.max(0, Math.min(1, ((x - ax) * dx + (y - ay) * dy) / len2)) : 0;
        const d = Math.sqrt((x - ax - t * dx) ** 2 + (y - ay - t * dy) ** 2);
        const i = (py - y0) * w + px - x0;
        if (d < dist[i]!) dist[i] = d;
      }
    }
  }
  return { x0, y0, w, h, inside, dist };
}

describe('review dummy PDF, strokes drawn', () => {
  it("every gag page: ink inside each pen stroke's outline, and none in the panels away from strokes and rooms", async () => {
    const res = await callRouteRaw(reviewRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    const file = await save(res, 'review-ink.pdf');
    const { spec } = (await findVolume(db, DEMO_VOLUME_ID))!;
    const { pages } = await volumePages(db, DEMO_VOLUME_ID);
    const DPI = 150;
    const mmPerPx = 25.4 / DPI;
    let strokesChecked = 0;
    let blankChecked = 0;
    for (const [index, page] of pages.entries()) {
      if (page.kind !== 'gag' || !page.strokes?.length) continue;
      const base = path.join(dir, `ink-${index + 1}`);
      execFileSync('pdftoppm', ['-f', String(index + 1), '-l', String(index + 1), '-r', String(DPI), '-png', '-singlefile', file, base]);
      const { data, info } = await sharp(`${base}.png`).removeAlpha().raw().toBuffer({ resolveWithObject: true });
      const lum = (px: number, py: number) => {
        const i = (py * info.width + px) * 3;
        return 0.299 * data[i]! + 0.587 * data[i + 1]! + 0.114 * data[i + 2]!;
      };
      // Pixel centres in mm from the trim's top left (the render covers the bleed box).
      const grid: Grid = { width: info.width, height: info.height, mmPerPx, bleed: spec.bleed };
      const mmX = (px: number) => centre(grid, px);
      const mmY = (py: number) => centre(grid, py);
      const pxOf = (mm: number) => pixelOf(grid, mm);
      const panels = panelRects(spec);
      const inRect = (r: Rect, x: number, y: number, inset: number) =>
        x >= r.x + inset && x <= r.x + r.w - inset && y >= r.y + inset && y <= r.y + r.h - inset;
      const near = new Uint8Array(info.width * info.height);
      for (const stroke of page.strokes) {
        const c = coverage(grid, outlineOf(stroke), 0.5);
        const deep: number[] = [];
        for (let i = 0; i < c.w * c.h; i++) {
          const px = c.x0 + (i % c.w);
          const py = c.y0 + Math.floor(i / c.w);
          const inside = c.inside[i] === 1;
          // Ink may reach a pixel past the outline (antialiasing, the curve between its vertices).
          if (inside || c.dist[i]! < 0.35) near[py * info.width + px] = 1;
          // A pixel well inside the outline, and inside the panel that clips the stroke, is wholly covered.
          if (inside && c.dist[i]! > 0.15 && inRect(panels[stroke.panel]!, mmX(px), mmY(py), 0.2)) deep.push(lum(px, py));
        }
        if (stroke.tool !== 'pen' || stroke.grey < 80 || deep.length < 3) continue;
        strokesChecked++;
        expect(deep.filter((l) => l < 128).length / deep.length, `stroke ${stroke.id} on page ${index + 1}`).toBeGreaterThan(0.8);
      }
      // Rooms are pale, but their dashed borders are dark: keep clear of them.
      const nearRoomEdge = (x: number, y: number) =>
        (page.rooms ?? []).some((r) => {
          if (r.shape === 'ellipse') {
            const q = Math.hypot((x - r.x - r.w / 2) / (r.w / 2), (y - r.y - r.h / 2) / (r.h / 2));
            return (Math.abs(q - 1) * Math.min(r.w, r.h)) / 2 < 0.5;
          }
          const inOuter = x >= r.x - 0.5 && x <= r.x + r.w + 0.5 && y >= r.y - 0.5 && y <= r.y + r.h + 0.5;
          const inInner = x > r.x + 0.5 && x < r.x + r.w - 0.5 && y > r.y + 0.5 && y < r.y + r.h - 0.5;
          return inOuter && !inInner;
        });
      const stray: string[] = [];
      for (const r of panels) {
        for (let py = pxOf(r.y + 1); py <= pxOf(r.y + r.h - 1); py++) {
          for (let px = pxOf(r.x + 1); px <= pxOf(r.x + r.w - 1); px++) {
            if (near[py * info.width + px] || nearRoomEdge(mmX(px), mmY(py))) continue;
            blankChecked++;
            if (lum(px, py) < 200) stray.push(`(${mmX(px).toFixed(1)}, ${mmY(py).toFixed(1)}) mm on page ${index + 1}`);
          }
        }
      }
      expect(stray.slice(0, 5)).toEqual([]);
    }
    // The demo's six gags: many pen strokes checked, and most of each panel seen blank.
    expect(strokesChecked).toBeGreaterThan(100);
    expect(blankChecked).toBeGreaterThan(6 * 4 * 100_000);
  });
});

describe('the PDF font', () => {
  it('unwrapped from its WOFF (the export embeds that), it is the same font: names, glyphs, metrics, layout', () => {
    const woff = fs.readFileSync(path.join(process.cwd(), 'fonts', 'atkinson-hyperlegible-latin-400-normal.woff'));
    const a = fontkit.create(woff);
    const b = fontkit.create(sfntFromWoff(woff));
    expect(b.postscriptName).toBe(a.postscriptName);
    expect(b.numGlyphs).toBe(a.numGlyphs);
    expect(b.unitsPerEm).toBe(a.unitsPerEm);
    const laid = (f: typeof a) => f.layout(`12 · Low Tide Lunch · ${PRINTER_NOTE}`).glyphs.map((g) => [g.id, g.advanceWidth]);
    expect(laid(b)).toEqual(laid(a));
  });
});

describe('drawing templates PDF', () => {
  it('A4 at 100 %, one page per gag; 200 % does not fit A4 and says so', async () => {
    const res = await callRouteRaw(templatesRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: '/x?scale=100&paper=A4' });
    expect(res.status).toBe(200);
    const file = await save(res, 'templates.pdf');
    const b = boxes(file);
    expect(b.pages).toBe(6);
    // ISO 216 A4: 210 × 297 mm = 595.28 × 841.89 pt
    expect(b.media[0]![2]).toBeCloseTo(595.28, 1);
    expect(b.media[0]![3]).toBeCloseTo(841.89, 1);
    const big = await callRouteRaw(templatesRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: '/x?scale=200&paper=A4' });
    expect(big.status).toBe(422);
    expect((await big.json()).error).toMatch(/does not fit on A4/);
    const bad = await callRouteRaw(templatesRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: '/x?scale=120' });
    expect(bad.status).toBe(422);
  });
  it('A3 at 150 %', async () => {
    const res = await callRouteRaw(templatesRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: '/x?scale=150&paper=A3' });
    expect(res.status).toBe(200);
    const b = boxes(await save(res, 'templates-a3.pdf'));
    expect(b.media[0]![2]).toBeCloseTo(841.89, 1); // A3 297 mm wide
  });
});

describe('running order CSV', () => {
  it('starts with the header (a spreadsheet reads any line above it as data), then the pages in order', async () => {
    const res = await callRouteRaw(csvRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    const text = await res.text();
    const lines = text.trim().split('\n');
    expect(lines[0]).toBe('page,kind,title,status,gag_id');
    expect(lines[1]).toBe('1,cover,Cover,,');
    expect(lines[3]).toBe('3,gag,Low Tide Lunch,placed,demo-gag-01');
    expect(lines).toHaveLength(10);
    expect(text).not.toMatch(/^#/m);
  });
});
