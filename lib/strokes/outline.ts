// A stroke's outline polygon (mm), from perfect-freehand. Every renderer — the
// editor canvas, the SVG thumbnails, later the PDF — and the ink-load findings
// draw this same polygon, so they all agree.
import { getStroke } from 'perfect-freehand';
import type { Point, Stroke, StrokeTool } from './types';

export type Polygon = [number, number][];

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

export function outlineOf(stroke: Pick<Stroke, 'tool' | 'size' | 'points'>, last = true): Polygon {
  const pts = stroke.points;
  if (pts.length === 0) return [];
  const scaled = pts.map(([x, y, p]) => [x * UNITS_PER_MM, y * UNITS_PER_MM, p] as Point);
  const outline = getStroke(scaled, { ...OPTIONS[stroke.tool], size: stroke.size * UNITS_PER_MM, last });
  return outline.map(([x, y]) => [x! / UNITS_PER_MM, y! / UNITS_PER_MM]);
}

const avg = (a: number, b: number) => (a + b) / 2;
const f = (n: number) => Math.round(n * 1000) / 1000;

/**
 * An SVG path for a closed outline: quadratic curves through the midpoints of
 * the outline's edges (the rendering perfect-freehand's documentation recommends),
 * written with explicit Q segments so every consumer (browsers, pdf-lib) reads it alike.
 */
export function svgPathFromOutline(poly: Polygon): string {
  const parts: string[] = [];
  traceOutline(
    {
      moveTo: (x, y) => parts.push(`M${f(x)},${f(y)}`),
      quadraticCurveTo: (cx, cy, x, y) => parts.push(`Q${f(cx)},${f(cy)} ${f(x)},${f(y)}`),
      closePath: () => parts.push('Z'),
    },
    poly,
  );
  return parts.join(' ');
}

/** The same closed curve as a canvas Path2D-compatible sequence of calls. */
export function traceOutline(
  ctx: { moveTo(x: number, y: number): void; quadraticCurveTo(cx: number, cy: number, x: number, y: number): void; closePath(): void },
  poly: Polygon,
) {
  const len = poly.length;
  if (len < 4) return;
  let prevMidX = avg(poly[1]![0], poly[2]![0]);
  let prevMidY = avg(poly[1]![1], poly[2]![1]);
  ctx.moveTo(poly[0]![0], poly[0]![1]);
  ctx.quadraticCurveTo(poly[1]![0], poly[1]![1], prevMidX, prevMidY);
  // SVG's T reflects the previous control point; reproduce that so canvas and SVG match.
  let ctrlX = poly[1]![0];
  let ctrlY = poly[1]![1];
  for (let i = 2; i < len - 1; i++) {
    const mx = avg(poly[i]![0], poly[i + 1]![0]);
    const my = avg(poly[i]![1], poly[i + 1]![1]);
    ctrlX = 2 * prevMidX - ctrlX;
    ctrlY = 2 * prevMidY - ctrlY;
    ctx.quadraticCurveTo(ctrlX, ctrlY, mx, my);
    prevMidX = mx;
    prevMidY = my;
  }
  ctx.closePath();
}
