import { describe, expect, it } from 'vitest';
import { DEFAULT_PAGE_SPEC, bleedBox, mmToPt, mmToPx, panelAt, panelRects, ptToMm, pxToMm, safeBox } from '@/lib/print/geometry';
import { fitView, toPage, toScreen, zoomAt } from '@/lib/print/view';

describe('the default page (150 mm square trim, 3 mm bleed, 5 mm safe, 4 mm gutter)', () => {
  it('bleed and safe boxes', () => {
    expect(bleedBox(DEFAULT_PAGE_SPEC)).toEqual({ x: -3, y: -3, w: 156, h: 156 });
    expect(safeBox(DEFAULT_PAGE_SPEC)).toEqual({ x: 5, y: 5, w: 140, h: 140 });
  });

  it('panel rectangles, worked out by hand', () => {
    // Safe area 140 mm wide; two panels and one 4 mm gutter: (140 − 4) / 2 = 68 mm each.
    // Left column starts at the safe margin, 5 mm; right column at 5 + 68 + 4 = 77 mm.
    expect(panelRects(DEFAULT_PAGE_SPEC)).toEqual([
      { x: 5, y: 5, w: 68, h: 68 },
      { x: 77, y: 5, w: 68, h: 68 },
      { x: 5, y: 77, w: 68, h: 68 },
      { x: 77, y: 77, w: 68, h: 68 },
    ]);
  });

  it('finds the panel under a point, and none in the gutter', () => {
    expect(panelAt(DEFAULT_PAGE_SPEC, 10, 10)).toBe(0);
    expect(panelAt(DEFAULT_PAGE_SPEC, 100, 10)).toBe(1);
    expect(panelAt(DEFAULT_PAGE_SPEC, 10, 100)).toBe(2);
    expect(panelAt(DEFAULT_PAGE_SPEC, 140, 140)).toBe(3);
    expect(panelAt(DEFAULT_PAGE_SPEC, 75, 40)).toBeNull();
    expect(panelAt(DEFAULT_PAGE_SPEC, 2, 2)).toBeNull();
  });
});

describe('units', () => {
  // 1 in = 25.4 mm exactly (international inch, 1959); 1 in = 72 pt (PDF 32000-1 §8.3.2.3 default user space).
  it('mm ↔ pt', () => {
    expect(mmToPt(25.4)).toBeCloseTo(72, 10);
    expect(mmToPt(150)).toBeCloseTo(425.19685, 5);
    expect(ptToMm(mmToPt(3))).toBeCloseTo(3, 12);
  });
  it('mm ↔ px at a given ppi', () => {
    expect(mmToPx(25.4, 300)).toBeCloseTo(300, 10);
    expect(mmToPx(150, 300)).toBeCloseTo(1771.65, 2);
    expect(pxToMm(600, 600)).toBeCloseTo(25.4, 10);
  });
});

describe('the editor view: mm ↔ screen px at several zooms', () => {
  it.each([0.5, 1, 4, 12.5, 40])('round-trips at %s px/mm', (scale) => {
    const v = { scale, originX: 31, originY: -7 };
    const s = toScreen(v, 68, 77);
    expect(s).toEqual({ x: 31 + 68 * scale, y: -7 + 77 * scale });
    const back = toPage(v, s.x, s.y);
    expect(back.x).toBeCloseTo(68, 9);
    expect(back.y).toBeCloseTo(77, 9);
  });
  it('zooming keeps the point under the cursor still', () => {
    const v = { scale: 4, originX: 20, originY: 30 };
    const before = toPage(v, 300, 200);
    const z = zoomAt(v, 2.5, 300, 200);
    expect(z.scale).toBe(10);
    const after = toPage(z, 300, 200);
    expect(after.x).toBeCloseTo(before.x, 9);
    expect(after.y).toBeCloseTo(before.y, 9);
  });
  it('fits the bleed box in the screen, centred', () => {
    const v = fitView(-3, -3, 156, 156, 800, 600, 24);
    expect(v.scale).toBeCloseTo((600 - 48) / 156, 9);
    const centre = toScreen(v, 75, 75);
    expect(centre.x).toBeCloseTo(400, 9);
    expect(centre.y).toBeCloseTo(300, 9);
  });
});
