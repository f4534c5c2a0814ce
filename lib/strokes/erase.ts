// The partial eraser (pure): where an eraser drawn along a path passes, strokes are
// cut. Each stroke it touches is removed and its remaining pieces are added as new
// strokes (fresh ids, the same panel, tool, grey and size, the pressure carried into
// each cut), so the result is ordinary ops of the pass log that merge like any other
// (shared/STROKES.md). All lengths are mm from the trim's top-left corner.
//
// A stroke is cut where its ink meets the eraser, as the whole-stroke eraser decides a
// touch (hit.ts, strokeTouches): where its centre line comes within the eraser's radius
// plus half the stroke's size. Cuts are made a storage quantum further out, so a cut end
// stays outside that reach once stored at 0.01 mm.
import { XY_QUANTUM_MM } from './codec';
import type { Op, Point, Stroke } from './types';

type V = [number, number];

/** Pieces shorter than this (mm along the line) are dropped: a speck under the nib. */
export const MIN_PIECE_MM = 0.3;
/** Cuts sit this much beyond the reach, so rounding a cut point to 0.01 mm never brings it back inside. */
export const CUT_MARGIN_MM = XY_QUANTUM_MM;

/** How far from the eraser's path a stroke's centre line is cut: its ink meets the eraser there. */
export const eraserReach = (stroke: Pick<Stroke, 'size'>, radius: number) => radius + stroke.size / 2;

/** The part t ∈ [lo, hi] of the segment a + t·d (t in 0…1) within r of point c; null if none. */
function discPart(a: V, d: V, c: V, r: number): [number, number] | null {
  const fx = a[0] - c[0];
  const fy = a[1] - c[1];
  const A = d[0] * d[0] + d[1] * d[1];
  const B = 2 * (fx * d[0] + fy * d[1]);
  const C = fx * fx + fy * fy - r * r;
  if (A === 0) return C <= 0 ? [0, 1] : null;
  const disc = B * B - 4 * A * C;
  if (disc < 0) return null;
  const s = Math.sqrt(disc);
  const lo = Math.max(0, (-B - s) / (2 * A));
  const hi = Math.min(1, (-B + s) / (2 * A));
  return lo <= hi ? [lo, hi] : null;
}

/** The part of the segment a + t·d within the band along p→q (of length len, unit u) reaching r either side. */
function bandPart(a: V, d: V, p: V, u: V, len: number, r: number): [number, number] | null {
  let lo = 0;
  let hi = 1;
  // Along the band: 0 ≤ (x − p)·u ≤ len; across it: −r ≤ (x − p)·v ≤ r, with v = u turned a quarter.
  const slabs: [number, number, number, number][] = [
    [(a[0] - p[0]) * u[0] + (a[1] - p[1]) * u[1], d[0] * u[0] + d[1] * u[1], 0, len],
    [-(a[0] - p[0]) * u[1] + (a[1] - p[1]) * u[0], -d[0] * u[1] + d[1] * u[0], -r, r],
  ];
  for (const [start, rate, min, max] of slabs) {
    if (rate === 0) {
      if (start < min || start > max) return null;
      continue;
    }
    const t1 = (min - start) / rate;
    const t2 = (max - start) / rate;
    lo = Math.max(lo, Math.min(t1, t2));
    hi = Math.min(hi, Math.max(t1, t2));
    if (lo > hi) return null;
  }
  return [lo, hi];
}

/**
 * The part of segment a→b inside the capsule of radius r round p→q (its two end discs and
 * the band between them). The capsule is convex, so that part is one interval: the hull of
 * the three parts.
 */
export function capsulePart(a: V, b: V, p: V, q: V, r: number): [number, number] | null {
  const d: V = [b[0] - a[0], b[1] - a[1]];
  const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
  const parts = [
    discPart(a, d, p, r),
    len > 0 ? discPart(a, d, q, r) : null,
    len > 0 ? bandPart(a, d, p, [(q[0] - p[0]) / len, (q[1] - p[1]) / len], len, r) : null,
  ];
  let lo = Infinity;
  let hi = -Infinity;
  for (const part of parts) {
    if (!part) continue;
    lo = Math.min(lo, part[0]);
    hi = Math.max(hi, part[1]);
  }
  return lo <= hi ? [lo, hi] : null;
}

/** The path as segments (a single point is a segment of no length). */
const segmentsOf = (path: V[]): [V, V][] => (path.length === 1 ? [[path[0]!, path[0]!]] : path.slice(1).map((q, i) => [path[i]!, q]));

/** The parts of the line a→b the eraser takes, merged and sorted (t in 0…1). */
function erasedParts(a: V, b: V, eraser: [V, V][], reach: number): [number, number][] {
  const minX = Math.min(a[0], b[0]) - reach;
  const maxX = Math.max(a[0], b[0]) + reach;
  const minY = Math.min(a[1], b[1]) - reach;
  const maxY = Math.max(a[1], b[1]) + reach;
  const parts: [number, number][] = [];
  for (const [p, q] of eraser) {
    if (Math.max(p[0], q[0]) < minX || Math.min(p[0], q[0]) > maxX || Math.max(p[1], q[1]) < minY || Math.min(p[1], q[1]) > maxY) continue;
    const part = capsulePart(a, b, p, q, reach);
    if (part) parts.push(part);
  }
  parts.sort((x, y) => x[0] - y[0]);
  const merged: [number, number][] = [];
  for (const part of parts) {
    const last = merged[merged.length - 1];
    if (last && part[0] <= last[1]) last[1] = Math.max(last[1], part[1]);
    else merged.push([part[0], part[1]]);
  }
  return merged;
}

const at = (a: Point, b: Point, t: number): Point =>
  t <= 0 ? a : t >= 1 ? b : [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, a[2] + (b[2] - a[2]) * t];

function lengthOf(points: Point[]): number {
  let n = 0;
  for (let i = 1; i < points.length; i++) n += Math.hypot(points[i]![0] - points[i - 1]![0], points[i]![1] - points[i - 1]![1]);
  return n;
}

/**
 * What is left of one stroke's line after the eraser: null when the eraser misses it,
 * else its pieces (each a list of points; none when all of it goes).
 */
export function piecesLeft(points: Point[], eraser: V[], reach: number): Point[][] | null {
  const segs = segmentsOf(eraser);
  if (points.length === 0 || segs.length === 0) return null;
  if (points.length === 1) {
    const p = points[0]!;
    return erasedParts([p[0], p[1]], [p[0], p[1]], segs, reach).length ? [] : null;
  }
  const pieces: Point[][] = [];
  // The piece being built: its last point is the start of the next segment.
  let open: Point[] | null = null;
  let cut = false;
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!;
    const b = points[i + 1]!;
    // A touch at a single point (lo = hi) takes nothing away.
    const gone = erasedParts([a[0], a[1]], [b[0], b[1]], segs, reach).filter(([lo, hi]) => hi - lo > 1e-12);
    if (gone.length) cut = true;
    // The kept parts of this segment: what lies between the erased ones.
    const kept: [number, number][] = [];
    let from = 0;
    for (const [lo, hi] of gone) {
      if (lo > from) kept.push([from, lo]);
      from = Math.max(from, hi);
    }
    if (from < 1) kept.push([from, 1]);
    if (open && (kept.length === 0 || kept[0]![0] > 0)) {
      pieces.push(open);
      open = null;
    }
    for (const [lo, hi] of kept) {
      open ??= [at(a, b, lo)];
      open.push(at(a, b, hi));
      if (hi < 1) {
        pieces.push(open);
        open = null;
      }
    }
  }
  if (open) pieces.push(open);
  return cut ? pieces : null;
}

/**
 * The ops a partial eraser makes: for each stroke whose ink the eraser (a path of points,
 * `radius` mm round it) meets, remove it and add the pieces left, each longer than
 * `minPiece` mm, as new strokes with ids from `newId`. Strokes it misses are left alone.
 */
export function eraseAlong(
  strokes: Stroke[],
  path: V[],
  radius: number,
  newId: () => string,
  { minPiece = MIN_PIECE_MM }: { minPiece?: number } = {},
): Op[] {
  const ops: Op[] = [];
  if (path.length === 0 || !(radius >= 0)) return ops;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const [x, y] of path) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  for (const s of strokes) {
    const reach = eraserReach(s, radius) + CUT_MARGIN_MM;
    // Cheap first: the stroke's bounds against the path's, grown by the reach. (The bounds, not the
    // points one by one: a straight line stored as its two ends passes right under the eraser.)
    let sx0 = Infinity;
    let sy0 = Infinity;
    let sx1 = -Infinity;
    let sy1 = -Infinity;
    for (const [x, y] of s.points) {
      sx0 = Math.min(sx0, x);
      sy0 = Math.min(sy0, y);
      sx1 = Math.max(sx1, x);
      sy1 = Math.max(sy1, y);
    }
    const near = sx1 >= minX - reach && sx0 <= maxX + reach && sy1 >= minY - reach && sy0 <= maxY + reach;
    if (!near) continue;
    const pieces = piecesLeft(s.points, path, reach);
    if (!pieces) continue;
    ops.push({ op: 'remove', strokeId: s.id });
    for (const points of pieces) {
      if (points.length < 2 || lengthOf(points) < minPiece) continue;
      ops.push({ op: 'add', stroke: { ...s, id: newId(), points } });
    }
  }
  return ops;
}
