import fc from 'fast-check';
import simplify from 'simplify-js';
import { describe, expect, it } from 'vitest';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import { XY_QUANTUM_MM, decodePoints, encodePoints } from '@/lib/strokes/codec';
import { pointInPolygon, pointsBounds, strokeInLasso, strokeTouches } from '@/lib/strokes/hit';
import { outlineOf, svgPathFromOutline } from '@/lib/strokes/outline';
import { simplifyPoints } from '@/lib/strokes/simplify';
import { passToSvg } from '@/lib/strokes/svg';
import type { Point } from '@/lib/strokes/types';

const pointArb = fc.tuple(
  fc.double({ min: -3, max: 153, noNaN: true }),
  fc.double({ min: -3, max: 153, noNaN: true }),
  fc.double({ min: 0, max: 1, noNaN: true }),
);

describe('point codec', () => {
  it('round-trips random strokes within the quantum (0.01 mm, pressure 1/255)', () => {
    fc.assert(
      fc.property(fc.array(pointArb, { minLength: 0, maxLength: 300 }), (pts) => {
        const back = decodePoints(encodePoints(pts as Point[]));
        expect(back).toHaveLength(pts.length);
        back.forEach(([x, y, p], i) => {
          const [ox, oy, op] = pts[i]!;
          expect(Math.abs(x - ox)).toBeLessThanOrEqual(XY_QUANTUM_MM / 2 + 1e-9);
          expect(Math.abs(y - oy)).toBeLessThanOrEqual(XY_QUANTUM_MM / 2 + 1e-9);
          expect(Math.abs(p - op)).toBeLessThanOrEqual(0.5 / 255 + 1e-9);
        });
      }),
      { numRuns: 300 },
    );
  });

  it('is at most a third of the JSON size for a hand-drawn-like stroke', () => {
    const pts: Point[] = Array.from({ length: 60 }, (_, i) => [
      20 + i * 0.7 + Math.sin(i / 3) * 2,
      30 + Math.cos(i / 5) * 6,
      0.4 + 0.3 * Math.sin(i / 9),
    ]);
    const json = JSON.stringify(pts.map(([x, y, p]) => [Math.round(x * 100) / 100, Math.round(y * 100) / 100, Math.round(p * 1000) / 1000]));
    expect(encodePoints(pts).length * 3).toBeLessThanOrEqual(json.length);
  });

  it('refuses unknown data', () => {
    expect(() => decodePoints(Uint8Array.from([9, 0]))).toThrow(/version/);
    expect(() => decodePoints(Uint8Array.from([1, 5, 2]))).toThrow(/Truncated/);
  });
});

describe('simplification', () => {
  it('keeps exactly the points simplify-js (Douglas–Peucker, highQuality) keeps', () => {
    fc.assert(
      fc.property(fc.array(pointArb, { minLength: 2, maxLength: 200 }), fc.double({ min: 0.01, max: 3, noNaN: true }), (pts, tol) => {
        const ours = simplifyPoints(pts as Point[], tol);
        const ref = simplify(
          pts.map(([x, y]) => ({ x, y })),
          tol,
          true,
        );
        expect(ours.map(([x, y]) => ({ x, y }))).toEqual(ref);
      }),
      { numRuns: 300 },
    );
  });
  it('drops collinear points and keeps pressure with its point', () => {
    const pts: Point[] = [
      [0, 0, 0.1],
      [1, 0, 0.2],
      [2, 0, 0.3],
      [3, 1, 0.9],
    ];
    expect(simplifyPoints(pts, 0.1)).toEqual([
      [0, 0, 0.1],
      [2, 0, 0.3],
      [3, 1, 0.9],
    ]);
  });
});

describe('hit tests', () => {
  const line: Point[] = [
    [10, 10, 0.5],
    [20, 10, 0.5],
  ];
  it('an eraser touches a stroke within its radius plus half the stroke width', () => {
    expect(strokeTouches(line, 1, 15, 11.4, 1)).toBe(true); // 1.4 ≤ 1 + 0.5
    expect(strokeTouches(line, 1, 15, 11.6, 1)).toBe(false);
    expect(strokeTouches(line, 1, 21.4, 10, 1)).toBe(true); // beyond the end, by the cap
  });
  it('point in polygon, and a lasso takes strokes mostly inside', () => {
    const sq: [number, number][] = [
      [0, 0],
      [30, 0],
      [30, 30],
      [0, 30],
    ];
    expect(pointInPolygon(15, 15, sq)).toBe(true);
    expect(pointInPolygon(35, 15, sq)).toBe(false);
    expect(strokeInLasso(line, sq)).toBe(true);
    expect(
      strokeInLasso(
        [
          [25, 10, 1],
          [40, 10, 1],
          [45, 10, 1],
        ],
        sq,
      ),
    ).toBe(false);
  });
  it('bounds', () => {
    expect(pointsBounds(line, 0.5)).toEqual({ x: 9.5, y: 9.5, w: 11, h: 1 });
  });
});

describe('outlines and SVG', () => {
  const stroke = {
    tool: 'pen' as const,
    size: 1.2,
    points: [
      [10, 10, 0.5],
      [15, 12, 0.6],
      [20, 10, 0.5],
    ] as Point[],
  };
  it('an outline surrounds the centre line', () => {
    const poly = outlineOf(stroke).flat();
    expect(poly.length).toBeGreaterThan(8);
    const xs = poly.map((p) => p[0]);
    expect(Math.min(...xs)).toBeLessThan(10.2);
    expect(Math.max(...xs)).toBeGreaterThan(19.8);
  });
  it('the SVG clips each stroke to its panel and holds one path per stroke', () => {
    const svg = passToSvg(DEFAULT_PAGE_SPEC, [{ id: 'a', panel: 2, grey: 100, ...stroke }], [], { idPrefix: 'x' });
    expect(svg).toContain('viewBox="-3 -3 156 156"');
    expect(svg).toContain('<clipPath id="x-c2"><rect x="5" y="77" width="68" height="68"/></clipPath>');
    expect(svg.match(/<path /g)).toHaveLength(1);
    expect(svg).toContain('clip-path="url(#x-c2)"');
    expect(svg).toContain(svgPathFromOutline(outlineOf(stroke)));
  });
});
