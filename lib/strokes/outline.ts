// A stroke's outline (mm): closed polygons whose union, filled by the non-zero rule,
// is the mark. Every renderer — the editor canvas, the SVG thumbnails and compare
// view, the PDFs — and the ink-load findings take this one outline and draw its
// polygons edge for edge (straight segments), so they all agree to the vertex.
//
// perfect-freehand shapes each run of the line (pressure, end caps, the pen's
// streamlining of a shaky hand). Two things keep the drawn line's corners, which its
// smoothing alone would round off into a lozenge when a shape is drawn with few points:
// the line is first filled in to points at most MAX_GAP apart (streamlining pulls each
// point toward the one before, so over long gaps it cuts across corners), and it is
// cut at each corner into runs whose round caps meet there, the join a round nib makes.
import { getStroke } from 'perfect-freehand';
import type { Point, Stroke, StrokeTool } from './types';

export type Polygon = [number, number][];
/** Closed polygons (each implicitly closed), to be filled together by the non-zero rule. */
export type Outline = Polygon[];

const OPTIONS: Record<StrokeTool, Parameters<typeof getStroke>[1]> = {
  pen: { thinning: 0.6, smoothing: 0.5, streamline: 0.35, simulatePressure: false },
  // A marker: even width, soft ends.
  tone: { thinning: 0, smoothing: 0.6, streamline: 0.45, simulatePressure: false },
};

/**
 * perfect-freehand works in screen-pixel-like units (it pads a single point by
 * one unit, for instance), so outlines are computed at 100 units per mm and
 * scaled back: a dot of size d comes out a disc of diameter d.
 */
const UNITS_PER_MM = 100;
/** Longest gap between the points handed to perfect-freehand (mm). */
export const MAX_GAP = 0.5;
/** Longest gap perfect-freehand may leave between outline points (mm): edges are drawn straight. */
const MAX_OUTLINE_STEP = 0.3;
/** A turn of the line at least this sharp, over CORNER_REACH each side, is a corner (radians). */
export const CORNER_TURN = (40 * Math.PI) / 180;
/** How far along the line its direction is taken on each side of a point (mm): a hand's tremor below this is no corner. */
export const CORNER_REACH = 0.5;

/** The points, repeats dropped, with points added along any gap longer than `maxGap` (pressure in step). */
export function filledIn(points: Point[], maxGap = MAX_GAP): Point[] {
  const out: Point[] = [];
  for (const p of points) {
    const prev = out[out.length - 1];
    if (prev && prev[0] === p[0] && prev[1] === p[1]) continue;
    if (prev) {
      const steps = Math.ceil(Math.hypot(p[0] - prev[0], p[1] - prev[1]) / maxGap);
      for (let k = 1; k < steps; k++) {
        const t = k / steps;
        out.push([prev[0] + (p[0] - prev[0]) * t, prev[1] + (p[1] - prev[1]) * t, prev[2] + (p[2] - prev[2]) * t]);
      }
    }
    out.push(p);
  }
  return out;
}

/**
 * Indices of the line's corners: points where the direction taken over `reach` before
 * and after turns by at least `turn`, each the sharpest within `reach` either side.
 */
export function cornersOf(pts: Point[], turn = CORNER_TURN, reach = CORNER_REACH): number[] {
  const n = pts.length;
  if (n < 3) return [];
  const arc = new Float64Array(n);
  for (let i = 1; i < n; i++) arc[i] = arc[i - 1]! + Math.hypot(pts[i]![0] - pts[i - 1]![0], pts[i]![1] - pts[i - 1]![1]);
  const turns = new Float64Array(n);
  const cosTurn = Math.cos(turn);
  let back = 0;
  let fwd = 1;
  for (let i = 1; i < n - 1; i++) {
    while (back + 1 < i && arc[i]! - arc[back + 1]! >= reach) back++;
    if (fwd <= i) fwd = i + 1;
    while (fwd < n - 1 && arc[fwd]! - arc[i]! < reach) fwd++;
    const ax = pts[i]![0] - pts[back]![0];
    const ay = pts[i]![1] - pts[back]![1];
    const bx = pts[fwd]![0] - pts[i]![0];
    const by = pts[fwd]![1] - pts[i]![1];
    const la = Math.hypot(ax, ay);
    const lb = Math.hypot(bx, by);
    if (la < 1e-6 || lb < 1e-6) continue;
    const cos = (ax * bx + ay * by) / (la * lb);
    if (cos <= cosTurn) turns[i] = Math.acos(Math.max(-1, Math.min(1, cos)));
  }
  const out: number[] = [];
  for (let i = 1; i < n - 1; i++) {
    if (turns[i] === 0) continue;
    let sharpest = true;
    for (let j = i - 1; j > 0 && arc[i]! - arc[j]! < reach && sharpest; j--) if (turns[j]! >= turns[i]!) sharpest = false;
    for (let j = i + 1; j < n - 1 && arc[j]! - arc[i]! < reach && sharpest; j++) if (turns[j]! > turns[i]!) sharpest = false;
    if (sharpest) out.push(i);
  }
  return out;
}

/** One run of the line (no corner inside it) as perfect-freehand's outline, in mm. */
function runOutline(run: Point[], tool: StrokeTool, size: number, last: boolean): Polygon {
  const scaled = run.map(([x, y, p]) => [x * UNITS_PER_MM, y * UNITS_PER_MM, p] as Point);
  const options = OPTIONS[tool]!;
  const smoothing = Math.min(options.smoothing ?? 0.5, MAX_OUTLINE_STEP / size);
  const outline = getStroke(scaled, { ...options, smoothing, size: size * UNITS_PER_MM, last });
  return outline.map(([x, y]) => [x! / UNITS_PER_MM, y! / UNITS_PER_MM]);
}

/** The outline of a stroke (`last` false while it is still being drawn: its end follows the pen loosely). */
export function outlineOf(stroke: Pick<Stroke, 'tool' | 'size' | 'points'>, last = true): Outline {
  if (stroke.points.length === 0) return [];
  const pts = filledIn(stroke.points);
  const cuts = [0, ...cornersOf(pts), pts.length - 1];
  if (pts.length === 1) return [runOutline(pts, stroke.tool, stroke.size, last)];
  const out: Outline = [];
  for (let k = 1; k < cuts.length; k++) {
    const poly = runOutline(pts.slice(cuts[k - 1], cuts[k]! + 1), stroke.tool, stroke.size, k < cuts.length - 1 || last);
    if (poly.length >= 3) out.push(poly);
  }
  return out;
}

const f = (n: number) => Math.round(n * 1000) / 1000;

/** An SVG path for an outline: each polygon edge for edge, to 0.001 mm. */
export function svgPathFromOutline(outline: Outline): string {
  const parts: string[] = [];
  traceOutline(
    {
      moveTo: (x, y) => parts.push(`M${f(x)},${f(y)}`),
      lineTo: (x, y) => parts.push(`L${f(x)},${f(y)}`),
      closePath: () => parts.push('Z'),
    },
    outline,
  );
  return parts.join('');
}

/** The same polygons as canvas (Path2D-compatible) calls; the PDF writer takes them too. */
export function traceOutline(ctx: { moveTo(x: number, y: number): void; lineTo(x: number, y: number): void; closePath(): void }, outline: Outline) {
  for (const poly of outline) {
    if (poly.length < 3) continue;
    ctx.moveTo(poly[0]![0], poly[0]![1]);
    for (let i = 1; i < poly.length; i++) ctx.lineTo(poly[i]![0], poly[i]![1]);
    ctx.closePath();
  }
}
