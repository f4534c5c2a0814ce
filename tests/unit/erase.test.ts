// The partial eraser's pure computation: the ops that cut strokes where an eraser passes.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { quantise, XY_QUANTUM_MM } from '@/lib/strokes/codec';
import { CUT_MARGIN_MM, MIN_PIECE_MM, capsulePart, eraseAlong, eraserReach } from '@/lib/strokes/erase';
import { applyOp, docFrom } from '@/lib/strokes/pass-model';
import type { Op, Point, Stroke, StrokeTool } from '@/lib/strokes/types';
import { batchSchema } from '@/lib/validation/pass';

type V = [number, number];

/** A number spread evenly over [min, max] (fc.double leans to the ends and to tiny values). */
const uniform = (min: number, max: number) => fc.integer({ min: 0, max: 1_000_000 }).map((n) => min + ((max - min) * n) / 1_000_000);

function counter(prefix = 'piece') {
  let n = 0;
  return () => `${prefix}-${++n}`;
}

function segDist(q: V, a: V, b: V): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const l = dx * dx + dy * dy;
  const t = l ? Math.max(0, Math.min(1, ((q[0] - a[0]) * dx + (q[1] - a[1]) * dy) / l)) : 0;
  return Math.hypot(q[0] - a[0] - t * dx, q[1] - a[1] - t * dy);
}

/** Distance from q to the eraser's path (a single point is a path too). */
const pathDist = (q: V, path: V[]) =>
  path.length === 1 ? Math.hypot(q[0] - path[0]![0], q[1] - path[0]![1]) : Math.min(...path.slice(1).map((b, i) => segDist(q, path[i]!, b)));

const line = (from: V, to: V, n: number, p0 = 0.2, p1 = 0.8): Point[] =>
  Array.from({ length: n + 1 }, (_, i) => [from[0] + ((to[0] - from[0]) * i) / n, from[1] + ((to[1] - from[1]) * i) / n, p0 + ((p1 - p0) * i) / n]);

const stroke = (id: string, points: Point[], extra: Partial<Stroke> = {}): Stroke => ({
  id,
  panel: 1,
  tool: 'pen',
  grey: 100,
  size: 0.6,
  points,
  ...extra,
});

const adds = (ops: Op[]) => ops.flatMap((o) => (o.op === 'add' ? [o.stroke] : []));

describe('cutting a stroke', () => {
  it('an eraser across the middle of a line: the line goes, its two ends come back as new strokes, cut where the ink meets the eraser', () => {
    const s = stroke('s1', line([10, 20], [30, 20], 20), { panel: 2, grey: 60, size: 0.6 });
    const ops = eraseAlong(
      [s],
      [
        [20, 10],
        [20, 30],
      ],
      1,
      counter(),
    );
    expect(ops.map((o) => o.op)).toEqual(['remove', 'add', 'add']);
    expect(ops[0]).toEqual({ op: 'remove', strokeId: 's1' });
    const [left, right] = adds(ops);
    // Reach: the eraser's 1 mm plus half the 0.6 mm line, and the 0.01 mm storage margin: 1.31 mm either side of x = 20.
    const reach = 1 + 0.3 + CUT_MARGIN_MM;
    expect(left!.points.at(-1)![0]).toBeCloseTo(20 - reach, 9);
    expect(right!.points[0]![0]).toBeCloseTo(20 + reach, 9);
    // The pressure carries on into the cut: 0.2 → 0.8 from x = 10 to 30.
    expect(left!.points.at(-1)![2]).toBeCloseTo(0.2 + (0.6 * (10 - reach)) / 20, 9);
    // Every other point is the original's, in order.
    expect(left!.points.slice(0, -1)).toEqual(s.points.filter((p) => p[0] < 20 - reach));
    expect(right!.points.slice(1)).toEqual(s.points.filter((p) => p[0] > 20 + reach));
    for (const piece of [left!, right!]) {
      expect(piece).toMatchObject({ panel: 2, tool: 'pen', grey: 60, size: 0.6 });
      expect(piece.id).not.toBe('s1');
    }
    expect(left!.id).not.toBe(right!.id);
    // The ops are a batch the server takes as it is.
    expect(batchSchema.safeParse({ batchId: 'b1', ops }).success).toBe(true);
  });

  it('a stroke the eraser misses is left alone; one it covers goes without pieces; a dot goes or stays whole', () => {
    const far = stroke('far', line([10, 50], [30, 50], 10));
    const under = stroke('under', line([19.5, 15], [20.5, 25], 10));
    const dotIn = stroke('dot-in', [[20, 12, 0.5]], { size: 2 });
    const dotOut = stroke('dot-out', [[23, 12, 0.5]], { size: 2 });
    const ops = eraseAlong(
      [far, under, dotIn, dotOut],
      [
        [20, 10],
        [20, 30],
      ],
      1,
      counter(),
    );
    expect(ops).toEqual([
      { op: 'remove', strokeId: 'under' },
      { op: 'remove', strokeId: 'dot-in' },
    ]);
  });

  it('a dab (one point) cuts a hole; pieces shorter than the minimum are dropped', () => {
    const s = stroke('s', line([10, 10], [20, 10], 10));
    const hole = eraseAlong([s], [[15, 10.2]], 0.5, counter());
    expect(adds(hole)).toHaveLength(2);
    // The cut: the circle of radius 0.5 + 0.3 + 0.01 round (15, 10.2) crosses y = 10 at 15 ± √(0.81² − 0.2²).
    const half = Math.sqrt(0.81 ** 2 - 0.2 ** 2);
    expect(adds(hole)[0]!.points.at(-1)![0]).toBeCloseTo(15 - half, 9);
    expect(adds(hole)[1]!.points[0]![0]).toBeCloseTo(15 + half, 9);
    // An eraser stopping 0.1 mm short of the end leaves a 0.1 mm piece there: under MIN_PIECE_MM, dropped.
    const nearEnd = 20 - 0.1 - (0.4 + 0.3 + CUT_MARGIN_MM);
    const ops = eraseAlong([s], [[nearEnd, 10]], 0.4, counter());
    expect(MIN_PIECE_MM).toBeGreaterThan(0.1);
    expect(adds(ops).map((p) => p.points[0]![0])).toEqual([10]);
    expect(eraseAlong([s], [[nearEnd, 10]], 0.4, counter(), { minPiece: 0 }).filter((o) => o.op === 'add')).toHaveLength(2);
  });

  it('the ops merge like any other: applied to the pass, the pieces replace the stroke; sent twice, nothing more happens', () => {
    const s = stroke('s', line([10, 10], [30, 10], 40));
    const other = stroke('o', line([10, 40], [30, 40], 4));
    const ops = eraseAlong(
      [s, other],
      [
        [15, 5],
        [15, 15],
        [25, 15],
        [25, 5],
      ],
      0.5,
      counter(),
    );
    const doc = docFrom([s, other], []);
    for (const op of [...ops, ...ops]) applyOp(doc, op);
    expect([...doc.strokes.keys()].sort()).toEqual(['o', 'piece-1', 'piece-2', 'piece-3']);
    // The remove is a tombstone: the original never comes back, even if its add arrives late.
    applyOp(doc, { op: 'add', stroke: s });
    expect(doc.strokes.has('s')).toBe(false);
  });

  it('capsulePart: the part of a segment within r of another, worked by hand', () => {
    // y = 0 from x = 0 to 10, against the capsule of radius 1 round (5, −3)–(5, 3): x ∈ [4, 6].
    const part = capsulePart([0, 0], [10, 0], [5, -3], [5, 3], 1)!;
    expect(part[0]).toBeCloseTo(0.4, 12);
    expect(part[1]).toBeCloseTo(0.6, 12);
    // Against its end cap only: the disc of radius 1 round (5, 0.5) meets y = 0 at 5 ± √0.75.
    const cap = capsulePart([0, 0], [10, 0], [5, 0.5], [5, 10], 1)!;
    expect(cap[0]).toBeCloseTo((5 - Math.sqrt(0.75)) / 10, 12);
    expect(cap[1]).toBeCloseTo((5 + Math.sqrt(0.75)) / 10, 12);
    expect(capsulePart([0, 0], [10, 0], [5, 2], [5, 10], 1)).toBeNull();
  });
});

/** A hand-drawn-ish stroke: a wandering polyline, sometimes dense, sometimes sparse. */
const someStroke = fc
  .record({
    tool: fc.constantFrom<StrokeTool>('pen', 'tone'),
    size: uniform(0.1, 6),
    start: fc.tuple(uniform(10, 60), uniform(10, 60)),
    steps: fc.array(
      fc.record({
        length: uniform(0, 6),
        angle: uniform(0, 2 * Math.PI),
        pressure: uniform(0, 1),
      }),
      { minLength: 0, maxLength: 40 },
    ),
  })
  .map(({ tool, size, start, steps }) => {
    const points: Point[] = [[start[0], start[1], 0.5]];
    for (const st of steps) {
      const [x, y] = points[points.length - 1]!;
      points.push([x + Math.cos(st.angle) * st.length, y + Math.sin(st.angle) * st.length, st.pressure]);
    }
    return { tool, size, points };
  });

const scene = fc.record({
  strokes: fc.array(someStroke, { minLength: 1, maxLength: 6 }),
  path: fc.array(fc.tuple(uniform(0, 80), uniform(0, 80)), { minLength: 1, maxLength: 8 }),
  radius: uniform(0.05, 6),
});

describe('property: pieces keep out of the eraser and keep everything else', () => {
  it('no point of a kept piece lies within the reach of the eraser path (nor once stored at 0.01 mm); every original point outside it is in a piece', () => {
    let cutRuns = 0;
    fc.assert(
      fc.property(scene, ({ strokes: shapes, path, radius }) => {
        const strokes = shapes.map((s, i) => stroke(`s${i}`, s.points, { tool: s.tool, size: s.size, grey: 40 + i }));
        const ops = eraseAlong(strokes, path, radius, counter(), { minPiece: 0 });
        const removed = new Set(ops.flatMap((o) => (o.op === 'remove' ? [o.strokeId] : [])));
        const pieces = adds(ops);
        if (pieces.length) cutRuns++;
        const ids = new Set(pieces.map((p) => p.id));
        expect(ids.size).toBe(pieces.length);
        // Each removed stroke's pieces follow its remove, in the stroke's style.
        let current: Stroke | undefined;
        for (const op of ops) {
          if (op.op === 'remove') current = strokes.find((s) => s.id === op.strokeId);
          else if (op.op === 'add') {
            expect(current).toBeDefined();
            expect({ ...op.stroke, id: current!.id, points: current!.points }).toEqual(current);
            const reach = eraserReach(current!, radius);
            for (const [i, p] of op.stroke.points.entries()) {
              expect(pathDist([p[0], p[1]], path)).toBeGreaterThanOrEqual(reach - 1e-9);
              const [qx, qy] = quantise(p);
              expect(pathDist([qx * XY_QUANTUM_MM, qy * XY_QUANTUM_MM], path)).toBeGreaterThanOrEqual(reach);
              // …and not between its points either.
              const next = op.stroke.points[i + 1];
              if (next)
                for (const t of [0.25, 0.5, 0.75])
                  expect(pathDist([p[0] + (next[0] - p[0]) * t, p[1] + (next[1] - p[1]) * t], path)).toBeGreaterThanOrEqual(reach - 1e-9);
            }
          }
        }
        for (const s of strokes) {
          const reach = eraserReach(s, radius);
          if (!removed.has(s.id)) {
            // Untouched: the eraser never came within reach of its line.
            for (const p of s.points) expect(pathDist([p[0], p[1]], path)).toBeGreaterThanOrEqual(reach - 1e-9);
            continue;
          }
          const mine = pieces.filter(
            (p) => ops.findIndex((o) => o.op === 'add' && o.stroke.id === p.id) > ops.findIndex((o) => o.op === 'remove' && o.strokeId === s.id),
          );
          const kept = new Set(mine.flatMap((p) => p.points.map((q) => q.join(','))));
          for (const p of s.points)
            if (pathDist([p[0], p[1]], path) > reach + CUT_MARGIN_MM + 1e-9) expect(kept.has(p.join(',')), `point ${p} of ${s.id}`).toBe(true);
        }
      }),
      { numRuns: 500 },
    );
    // The scenes do cut: many runs leave pieces to check.
    expect(cutRuns).toBeGreaterThan(100);
  }, 60_000);

  it('with the default minimum, only what lies within the minimum of a cut may go besides', () => {
    fc.assert(
      fc.property(scene, ({ strokes: shapes, path, radius }) => {
        const strokes = shapes.map((s, i) => stroke(`s${i}`, s.points, { tool: s.tool, size: s.size }));
        const ops = eraseAlong(strokes, path, radius, counter());
        const kept = new Set(adds(ops).flatMap((p) => p.points.map((q) => q.join(','))));
        for (const p of adds(ops)) {
          let length = 0;
          for (let i = 1; i < p.points.length; i++)
            length += Math.hypot(p.points[i]![0] - p.points[i - 1]![0], p.points[i]![1] - p.points[i - 1]![1]);
          expect(length).toBeGreaterThanOrEqual(MIN_PIECE_MM);
        }
        const removed = new Set(ops.flatMap((o) => (o.op === 'remove' ? [o.strokeId] : [])));
        for (const s of strokes.filter((x) => removed.has(x.id))) {
          const far = eraserReach(s, radius) + CUT_MARGIN_MM + MIN_PIECE_MM + 1e-9;
          for (const p of s.points) if (pathDist([p[0], p[1]], path) > far) expect(kept.has(p.join(','))).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  }, 60_000);
});

describe('eraseAlong on a straight line stored as its two ends', () => {
  it('cuts it where the eraser crosses between the ends (no point of the line lies near the eraser)', () => {
    const two: Stroke = {
      id: 'two',
      panel: 0,
      tool: 'pen',
      grey: 100,
      size: 0.5,
      points: [
        [10, 20, 0.5],
        [70, 20, 0.5],
      ],
    };
    let n = 0;
    const ops = eraseAlong(
      [two],
      [
        [40, 10],
        [40, 30],
      ],
      2,
      () => `p${++n}`,
    );
    expect(ops.map((o) => o.op)).toEqual(['remove', 'add', 'add']);
    const pieces = ops.flatMap((o) => (o.op === 'add' ? [o.stroke] : []));
    expect(Math.max(...pieces[0]!.points.map(([x]) => x))).toBeLessThan(40 - 2);
    expect(Math.min(...pieces[1]!.points.map(([x]) => x))).toBeGreaterThan(40 + 2);
  });
});
