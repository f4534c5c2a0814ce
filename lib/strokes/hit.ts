// Bounds and hit tests for erasing and lasso selection (mm).
import type { Rect } from '@/lib/print/geometry';
import type { Point } from './types';

export function pointsBounds(points: Point[], pad = 0): Rect {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const [x, y] of points) {
    if (x < minX) minX = x;
    if (y < minY) minY = y;
    if (x > maxX) maxX = x;
    if (y > maxY) maxY = y;
  }
  if (minX === Infinity) return { x: 0, y: 0, w: 0, h: 0 };
  return { x: minX - pad, y: minY - pad, w: maxX - minX + 2 * pad, h: maxY - minY + 2 * pad };
}

export function rectsOverlap(a: Rect, b: Rect): boolean {
  return a.x <= b.x + b.w && b.x <= a.x + a.w && a.y <= b.y + b.h && b.y <= a.y + a.h;
}

function distToSegmentSq(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const len = dx * dx + dy * dy;
  let t = len === 0 ? 0 : ((px - ax) * dx + (py - ay) * dy) / len;
  t = Math.max(0, Math.min(1, t));
  const cx = ax + t * dx - px;
  const cy = ay + t * dy - py;
  return cx * cx + cy * cy;
}

/** Does a circle of `radius` at (x, y) touch a stroke of width `size` along `points`? */
export function strokeTouches(points: Point[], size: number, x: number, y: number, radius: number): boolean {
  const reach = radius + size / 2;
  const reachSq = reach * reach;
  if (points.length === 1) {
    const [px, py] = points[0]!;
    return (px - x) ** 2 + (py - y) ** 2 <= reachSq;
  }
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1]!;
    const b = points[i]!;
    if (distToSegmentSq(x, y, a[0], a[1], b[0], b[1]) <= reachSq) return true;
  }
  return false;
}

/** Even–odd ray casting. */
export function pointInPolygon(x: number, y: number, poly: [number, number][]): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i]!;
    const [xj, yj] = poly[j]!;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** A lasso takes a stroke when at least half of its points lie inside. */
export function strokeInLasso(points: Point[], lasso: [number, number][]): boolean {
  if (lasso.length < 3 || points.length === 0) return false;
  let n = 0;
  for (const [x, y] of points) if (pointInPolygon(x, y, lasso)) n++;
  return n * 2 >= points.length;
}
