// Blue-line sheet layout: which scale × paper pairs fit, and how a page is tiled across sheets.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import { PAPERS, TILE_EDGE, TILE_OVERLAP, fitsOneSheet, guideTint, sheetCanvas, sheetSizes, tiling } from '@/lib/print/sheets';

// ISO 216: A4 is 210 × 297 mm, A3 297 × 420 mm.
describe('which sizes fit one sheet', () => {
  it('the demo book (150 mm square, 3 mm bleed): 200 % is 312 mm of bleed box, wider than A3 (297 mm), so only tiled', () => {
    expect((150 + 2 * 3) * 2).toBe(312);
    expect(PAPERS.A3.w).toBe(297);
    expect(fitsOneSheet(DEFAULT_PAGE_SPEC, 2, 'A3')).toBe(false);
    expect(fitsOneSheet(DEFAULT_PAGE_SPEC, 2, 'A4')).toBe(false);
    // 150 %: 234 mm of bleed box and 8 mm margins each side = 250 mm: over A4's 210, under A3's 297.
    expect(fitsOneSheet(DEFAULT_PAGE_SPEC, 1.5, 'A4')).toBe(false);
    expect(fitsOneSheet(DEFAULT_PAGE_SPEC, 1.5, 'A3')).toBe(true);
    expect(fitsOneSheet(DEFAULT_PAGE_SPEC, 1, 'A4')).toBe(true);
    const sizes = sheetSizes(DEFAULT_PAGE_SPEC);
    expect(sizes.filter((s) => !s.tiled).map((s) => `${s.scale} ${s.paper}`)).toEqual(['100 A4', '100 A3', '150 A3']);
    expect(sizes.filter((s) => s.tiled).map((s) => `${s.scale} ${s.paper} ${s.sheetsPerPage}`)).toEqual(['150 A4 2', '200 A4 4', '200 A3 2']);
  });

  it('a sheet that fits holds the whole canvas: bleed box, marks, bar and notes inside the paper', () => {
    for (const s of sheetSizes(DEFAULT_PAGE_SPEC).filter((x) => !x.tiled)) {
      const c = sheetCanvas(DEFAULT_PAGE_SPEC, s.scale / 100);
      expect(c.w).toBeLessThanOrEqual(PAPERS[s.paper].w);
      expect(c.h).toBeLessThanOrEqual(PAPERS[s.paper].h);
      // The notes start below the bar, which starts below the bleed box.
      expect(c.barY).toBeGreaterThan(c.bleed.y + c.bleed.h);
      expect(c.notesY).toBeGreaterThan(c.barY + 1.5);
    }
  });

  it('a bigger book fits fewer sizes: A5 (148 × 210 mm) at 150 % is 324 mm tall in bleed box alone', () => {
    const a5 = { ...DEFAULT_PAGE_SPEC, trimW: 148, trimH: 210 };
    expect(fitsOneSheet(a5, 1, 'A4')).toBe(true);
    // Tall: 216 mm of bleed box, 8 + 15 above, 11 + 38 + 8 below = 296 mm ≤ 297; at 150 %, 324 + 80 = 404 ≤ 420.
    expect(fitsOneSheet(a5, 1.5, 'A3')).toBe(true);
    expect(fitsOneSheet(a5, 2, 'A3')).toBe(false);
  });
});

describe('tiling', () => {
  it('150 % on A4 turns the paper: two landscape sheets instead of four upright', () => {
    const t = tiling(sheetCanvas(DEFAULT_PAGE_SPEC, 1.5), 'A4');
    expect(t.landscape).toBe(true);
    expect(t.sheet).toEqual({ w: 297, h: 210 });
    expect([t.cols, t.rows]).toEqual([1, 2]);
  });

  it('every canvas point lies in some window; neighbours share exactly the overlap, and each seam lies inside both', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 1200, noNaN: true }),
        fc.double({ min: 50, max: 1200, noNaN: true }),
        fc.constantFrom('A4' as const, 'A3' as const),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (w, h, paper, u, v) => {
          const t = tiling({ w, h }, paper);
          expect(t.window).toEqual({ w: t.sheet.w - 2 * TILE_EDGE, h: t.sheet.h - 2 * TILE_EDGE });
          expect(t.tiles).toHaveLength(t.cols * t.rows);
          const x = u * w;
          const y = v * h;
          const holding = t.tiles.filter((k) => x >= k.x - 1e-9 && x <= k.x + t.window.w + 1e-9 && y >= k.y - 1e-9 && y <= k.y + t.window.h + 1e-9);
          expect(holding.length).toBeGreaterThan(0);
          for (const [i, sx] of t.seamsX.entries()) {
            const left = t.tiles.find((k) => k.col === i && k.row === 0)!;
            const right = t.tiles.find((k) => k.col === i + 1 && k.row === 0)!;
            expect(left.x + t.window.w - right.x).toBeCloseTo(TILE_OVERLAP, 9);
            expect(sx - right.x).toBeCloseTo(TILE_OVERLAP / 2, 9);
          }
          for (const [i, sy] of t.seamsY.entries()) {
            const top = t.tiles.find((k) => k.row === i && k.col === 0)!;
            const below = t.tiles.find((k) => k.row === i + 1 && k.col === 0)!;
            expect(top.y + t.window.h - below.y).toBeCloseTo(TILE_OVERLAP, 9);
            expect(sy - below.y).toBeCloseTo(TILE_OVERLAP / 2, 9);
          }
          // No more sheets than needed: one fewer column (or row) would leave part of the canvas uncovered.
          const step = (n: number) => n - TILE_OVERLAP;
          if (t.cols > 1) expect((t.cols - 1) * step(t.window.w) + TILE_OVERLAP).toBeLessThan(w);
          if (t.rows > 1) expect((t.rows - 1) * step(t.window.h) + TILE_OVERLAP).toBeLessThan(h);
        },
      ),
    );
  });
});

describe('the guide colour', () => {
  it('at full strength a black pen mark is the non-photo blue itself (#A4DDED, common practice, from memory); white paper at zero', () => {
    expect(guideTint('blue', 1, 1).map((c) => Math.round(c * 255))).toEqual([0xa4, 0xdd, 0xed]);
    expect(guideTint('blue', 1, 0)).toEqual([1, 1, 1]);
    const half = guideTint('grey', 0.5, 1);
    expect(half[0]).toBeCloseTo(1 - (1 - 0.62) * 0.5, 12);
    expect(half[0]).toBe(half[2]);
  });
});
