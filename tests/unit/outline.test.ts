// The one outline function every renderer draws: a drawn polyline's corners survive its
// smoothing (property, fast-check), and the canvas, SVG and PDF paths are its polygons exactly.
import { inflateSync } from 'node:zlib';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ContentWriter, writeOutline } from '@/lib/export/pdf-content';
import { type Outline, outlineOf, svgPathFromOutline, traceOutline } from '@/lib/strokes/outline';
import type { Point, StrokeTool } from '@/lib/strokes/types';

type V = [number, number];

/** A number spread evenly over [min, max] (fc.double leans to the ends and to tiny values). */
const uniform = (min: number, max: number) => fc.integer({ min: 0, max: 1_000_000 }).map((n) => min + ((max - min) * n) / 1_000_000);

/** Distance from q to the segment ab. */
function segDist(q: V, a: V, b: V): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const l = dx * dx + dy * dy;
  const t = l ? Math.max(0, Math.min(1, ((q[0] - a[0]) * dx + (q[1] - a[1]) * dy) / l)) : 0;
  return Math.hypot(q[0] - a[0] - t * dx, q[1] - a[1] - t * dy);
}

function boundaryDist(q: V, outline: Outline): number {
  let best = Infinity;
  for (const poly of outline) for (let i = 0; i < poly.length; i++) best = Math.min(best, segDist(q, poly[i]!, poly[(i + 1) % poly.length]!));
  return best;
}

/** Inside by the non-zero rule over all the polygons, as canvas, SVG and PDF fill them. */
function inside(q: V, outline: Outline): boolean {
  let winding = 0;
  for (const poly of outline) {
    for (let i = 0; i < poly.length; i++) {
      const [ax, ay] = poly[i]!;
      const [bx, by] = poly[(i + 1) % poly.length]!;
      if (ay <= q[1] === by <= q[1]) continue;
      const x = ax + ((q[1] - ay) * (bx - ax)) / (by - ay);
      if (x > q[0]) winding += by > ay ? 1 : -1;
    }
  }
  return winding !== 0;
}

const signedArea = (poly: V[]) =>
  poly.reduce((s, a, i) => s + a[0] * poly[(i + 1) % poly.length]![1] - poly[(i + 1) % poly.length]![0] * a[1], 0) / 2;

/** The half-width perfect-freehand gives at a pressure (its getStrokeRadius: size × (0.5 − thinning × (0.5 − p))). */
const halfWidth = (tool: StrokeTool, size: number, p: number) => (tool === 'pen' ? size * (0.5 - 0.6 * (0.5 - p)) : size / 2);

/** A polyline of corners, sampled as a pointer would (sparse or dense), quantised to 0.01 mm as stored. */
const drawnPolyline = fc
  .record({
    tool: fc.constantFrom<StrokeTool>('pen', 'tone'),
    sizeT: uniform(0, 1),
    start: fc.tuple(uniform(20, 60), uniform(20, 60)),
    heading: uniform(0, 2 * Math.PI),
    legs: fc.array(
      fc.record({
        length: uniform(0, 1),
        turn: uniform(10, 170),
        left: fc.boolean(),
        pressure: uniform(0.2, 1),
        spacing: fc.constantFrom(0.05, 0.2, 0.7, 2, 1000),
      }),
      { minLength: 2, maxLength: 6 },
    ),
    last: fc.boolean(),
  })
  .map(({ tool, sizeT, start, heading, legs, last }) => {
    const size = tool === 'pen' ? 0.2 + sizeT * 1.8 : 1 + sizeT * 7;
    const q = (v: number) => Math.round(v * 100) / 100;
    const corners: { at: V; pressure: number }[] = [{ at: start, pressure: legs[0]!.pressure }];
    let dir = heading;
    const points: Point[] = [[q(start[0]), q(start[1]), legs[0]!.pressure]];
    legs.forEach((leg, i) => {
      if (i > 0) dir += ((leg.left ? 1 : -1) * leg.turn * Math.PI) / 180;
      // Long enough that the corner has room: past both round caps and a little.
      const length = size + 1.5 + leg.length * 25;
      const from = corners[corners.length - 1]!;
      const to: V = [from.at[0] + Math.cos(dir) * length, from.at[1] + Math.sin(dir) * length];
      const steps = Math.max(1, Math.ceil(length / leg.spacing));
      for (let k = 1; k <= steps; k++) {
        const t = k / steps;
        points.push([
          q(from.at[0] + (to[0] - from.at[0]) * t),
          q(from.at[1] + (to[1] - from.at[1]) * t),
          from.pressure + (leg.pressure - from.pressure) * t,
        ]);
      }
      corners.push({ at: [q(to[0]), q(to[1])], pressure: leg.pressure });
    });
    return { stroke: { tool, size, points }, corners, last };
  });

describe("a drawn polyline's corners survive the outline (within 0.3 mm at 100 %)", { timeout: 30_000 }, () => {
  it('a box of five points keeps its four corners (it came out a lozenge, some 6 mm short of each)', () => {
    const box: Point[] = [
      [10, 10, 0.5],
      [30, 10, 0.5],
      [30, 30, 0.5],
      [10, 30, 0.5],
      [10, 10, 0.5],
    ];
    const r = 0.3; // pen 0.6 mm at pressure 0.5
    const outline = outlineOf({ tool: 'pen', size: 0.6, points: box });
    for (const [x, y, ux, uy] of [
      [30, 10, 1, -1],
      [30, 30, 1, 1],
      [10, 30, -1, 1],
    ] as const) {
      const tip: V = [x + (ux * r) / Math.SQRT2, y + (uy * r) / Math.SQRT2];
      expect(boundaryDist(tip, outline)).toBeLessThan(0.05);
      expect(inside([x, y], outline)).toBe(true);
    }
  });

  it('property: at every corner the outline passes within 0.3 mm of the corner of a round-nibbed line, with ink up to it, and never strays', () => {
    let checked = 0;
    fc.assert(
      fc.property(drawnPolyline, ({ stroke, corners, last }) => {
        const outline = outlineOf(stroke, last);
        // One orientation for all polygons: filled together by the non-zero rule they make the union, never a hole.
        const signs = new Set(outline.map((p) => Math.sign(signedArea(p))));
        expect(signs.size).toBe(1);
        const segments = corners.slice(1).map((c, i) => [corners[i]!.at, c.at] as const);
        const widest = Math.max(...corners.map((c) => halfWidth(stroke.tool, stroke.size, c.pressure)));
        // Nothing strays: every outline vertex lies within the widest half-width (and 0.3 mm) of the line.
        let farthest = 0;
        for (const v of outline.flat()) farthest = Math.max(farthest, Math.min(...segments.map(([a, b]) => segDist(v, a, b))));
        expect(farthest).toBeLessThanOrEqual(widest + 0.3);
        for (let i = 1; i < corners.length - 1; i++) {
          const c = corners[i]!.at;
          const [a, b] = [corners[i - 1]!.at, corners[i + 1]!.at];
          const din: V = [(c[0] - a[0]) / Math.hypot(c[0] - a[0], c[1] - a[1]), (c[1] - a[1]) / Math.hypot(c[0] - a[0], c[1] - a[1])];
          const dout: V = [(b[0] - c[0]) / Math.hypot(b[0] - c[0], b[1] - c[1]), (b[1] - c[1]) / Math.hypot(b[0] - c[0], b[1] - c[1])];
          const out: V = [din[0] - dout[0], din[1] - dout[1]];
          const len = Math.hypot(out[0], out[1]);
          const u: V = [out[0] / len, out[1] / len];
          const r = halfWidth(stroke.tool, stroke.size, corners[i]!.pressure);
          // Where a round nib of that width puts the corner's outer edge.
          const tip: V = [c[0] + u[0] * r, c[1] + u[1] * r];
          // Another part of the line that covers the tip hides this corner: nothing to see there.
          const covered = segments.some(([p, q], k) => k !== i - 1 && k !== i && segDist(tip, p, q) < widest + 0.4);
          if (covered) continue;
          checked++;
          expect(boundaryDist(tip, outline), `corner ${i} at ${c}`).toBeLessThanOrEqual(0.3);
          // …from the ink's side: a line wider than 0.6 mm is inked up to 0.3 mm short of the tip.
          if (r > 0.3) expect(inside([c[0] + u[0] * (r - 0.3), c[1] + u[1] * (r - 0.3)], outline), `ink towards corner ${i}`).toBe(true);
        }
      }),
      { numRuns: 1000 },
    );
    // Most corners are in the open (not hidden under another part of the line), and were held to it.
    expect(checked).toBeGreaterThan(1500);
  }, 60_000);
});

// Property runs over many random lines: more than the default 5 s on a machine busy with other suites.
describe('every renderer draws the same polygons', { timeout: 30_000 }, () => {
  const someStroke = drawnPolyline.map((d) => d.stroke);

  it('canvas calls, the SVG path and the PDF path: the outline edge for edge (SVG to 0.001 mm, PDF to 1 µm)', () => {
    fc.assert(
      fc.property(someStroke, (stroke) => {
        const outline = outlineOf(stroke);
        const calls: Outline = [];
        traceOutline(
          {
            moveTo: (x, y) => calls.push([[x, y]]),
            lineTo: (x, y) => calls[calls.length - 1]!.push([x, y]),
            closePath: () => undefined,
          },
          outline,
        );
        expect(calls).toEqual(outline.filter((p) => p.length >= 3));
        const fromSvg = svgPathFromOutline(outline)
          .split('Z')
          .filter(Boolean)
          .map((sub) => [...sub.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])] as V));
        expect(fromSvg).toHaveLength(calls.length);
        fromSvg.forEach((poly, i) =>
          poly.forEach((v, k) => expect(Math.hypot(v[0] - calls[i]![k]![0], v[1] - calls[i]![k]![1])).toBeLessThan(0.001)),
        );
        const pdf = new ContentWriter();
        writeOutline(pdf, outline);
        const ops = inflateSync(pdf.deflated()).toString('latin1');
        const fromPdf = ops
          .split('h\n')
          .filter(Boolean)
          .map((sub) => [...sub.matchAll(/(-?\d+) (-?\d+) [ml]\n/g)].map((m) => [Number(m[1]) / 1000, Number(m[2]) / 1000] as V));
        expect(fromPdf).toHaveLength(calls.length);
        fromPdf.forEach((poly, i) =>
          poly.forEach((v, k) => expect(Math.hypot(v[0] - calls[i]![k]![0], v[1] - calls[i]![k]![1])).toBeLessThan(0.001)),
        );
      }),
      { numRuns: 50 },
    );
  });
});
