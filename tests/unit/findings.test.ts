import { describe, expect, it } from 'vitest';
import { DEFAULT_PAGE_SPEC, panelRects } from '@/lib/print/geometry';
import { computeFindings, discTouchesRoom, panelInkLoad } from '@/lib/review/findings';
import { CoverageGrid } from '@/lib/review/raster';
import { outlineOf } from '@/lib/strokes/outline';
import type { Point, Stroke } from '@/lib/strokes/types';

const panel0 = panelRects(DEFAULT_PAGE_SPEC)[0]!; // 68 × 68 mm at (5, 5)
const PANEL_AREA = 68 * 68;

function straight(x0: number, y: number, length: number, width: number, tool: Stroke['tool'] = 'tone'): Stroke {
  const n = Math.max(2, Math.round(length / 0.25) + 1);
  const points: Point[] = Array.from({ length: n }, (_, i) => [x0 + (length * i) / (n - 1), y, 0.5]);
  return { id: `s${x0}-${y}`, panel: 0, tool, grey: 40, size: width, points };
}

describe('coverage grid', () => {
  it('a square covers its own area exactly', () => {
    const g = new CoverageGrid({ x: 0, y: 0, w: 10, h: 10 }, 100, 100);
    g.fillPolygon([
      [2, 2],
      [6, 2],
      [6, 7],
      [2, 7],
    ]);
    expect(g.coveredArea()).toBeCloseTo(20, 6);
  });
  it('overlapping marks count once (a union, not a sum)', () => {
    const g = new CoverageGrid({ x: 0, y: 0, w: 10, h: 10 }, 100, 100);
    g.fillPolygon([
      [0, 0],
      [5, 0],
      [5, 5],
      [0, 5],
    ]);
    g.fillPolygon([
      [0, 0],
      [5, 0],
      [5, 5],
      [0, 5],
    ]);
    expect(g.coverage()).toBeCloseTo(0.25, 6);
  });
});

describe('ink load against analytic areas (error ≤ 2%)', () => {
  // A straight stroke of width w and length L with round caps is a stadium:
  // area = w·L + π·w²/4 (rectangle plus two half discs; elementary geometry).
  it.each([
    [2, 40, 40],
    [4, 30, 40],
    [8, 20, 40],
    [1, 10, 38.77],
    [0.6, 25, 41.13],
  ])('a straight stroke %s mm wide and %s mm long (at y = %s mm)', (w, L, y) => {
    const s = straight(20, y, L, w);
    const load = panelInkLoad(panel0, outlineOf(s));
    const expected = (w * L + (Math.PI * w * w) / 4) / PANEL_AREA;
    expect(Math.abs(load - expected) / expected).toBeLessThanOrEqual(0.02);
  });

  // A filled disc of radius r covers π·r².
  it.each([3, 6, 10])('a disc of radius %s mm', (r) => {
    const dot: Stroke = { id: 'dot', panel: 0, tool: 'tone', grey: 40, size: 2 * r, points: [[39, 39, 0.5]] };
    const load = panelInkLoad(panel0, outlineOf(dot));
    const expected = (Math.PI * r * r) / PANEL_AREA;
    expect(Math.abs(load - expected) / expected).toBeLessThanOrEqual(0.02);
  });
});

describe('findings', () => {
  const beats = [
    { kind: 'setup' as const, note: 'Pier.' },
    { kind: 'build' as const, note: '' },
    { kind: 'turn' as const, note: 'Wave.' },
    { kind: 'payoff' as const, note: '  ' },
  ];

  it('flags heavy ink above the threshold, empty panels and beats without notes', () => {
    const heavy = Array.from({ length: 30 }, (_, i) => straight(6, 7 + i * 2.2, 64, 3));
    const f = computeFindings(DEFAULT_PAGE_SPEC, heavy, [], beats);
    expect(f.panels[0]!.inkLoad).toBeGreaterThan(0.35);
    expect(f.panels[0]!.inkHeavy).toBe(true);
    expect(f.panels.slice(1).map((p) => p.empty)).toEqual([true, true, true]);
    expect(f.beatsMissing).toEqual(['build', 'payoff']);
  });

  it('names the strokes that reach into a balloon room', () => {
    const inRoom = straight(10, 12, 10, 1);
    const clear = straight(10, 50, 10, 1);
    const room = { id: 'r', panel: 0, shape: 'rect' as const, x: 8, y: 8, w: 20, h: 8 };
    const f = computeFindings(DEFAULT_PAGE_SPEC, [inRoom, clear], [room], beats);
    expect(f.panels[0]!.roomIntrusions).toBe(1);
    expect(f.panels[0]!.roomIntrusionIds).toEqual([inRoom.id]);
  });

  it('an ellipse room is met by its rim, not its bounding box corner', () => {
    const room = { shape: 'ellipse' as const, x: 0, y: 0, w: 20, h: 10 };
    expect(discTouchesRoom(10, 5, 0.1, room)).toBe(true);
    expect(discTouchesRoom(0.5, 0.5, 0.1, room)).toBe(false); // the corner of the box
    expect(discTouchesRoom(20.4, 5, 0.5, room)).toBe(true); // just outside, within the mark's half width
  });

  it('marks that run past the safe area are named', () => {
    const past = straight(2, 30, 20, 1); // starts 3 mm left of the safe area's edge at 5 mm
    const inside = straight(20, 30, 20, 1);
    const f = computeFindings(DEFAULT_PAGE_SPEC, [past, inside], [], beats);
    expect(f.panels[0]!.outsideSafeIds).toEqual([past.id]);
  });
});
