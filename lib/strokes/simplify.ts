// Ramer–Douglas–Peucker simplification of a stroke's points, in mm. Pressure
// rides along with the point it belongs to. Tolerance is the largest distance
// (mm) a dropped point may lie from the simplified line.
import type { Point } from './types';

function sqSegDist(p: Point, a: Point, b: Point): number {
  let x = a[0];
  let y = a[1];
  let dx = b[0] - x;
  let dy = b[1] - y;
  if (dx !== 0 || dy !== 0) {
    const t = ((p[0] - x) * dx + (p[1] - y) * dy) / (dx * dx + dy * dy);
    if (t > 1) {
      x = b[0];
      y = b[1];
    } else if (t > 0) {
      x += dx * t;
      y += dy * t;
    }
  }
  dx = p[0] - x;
  dy = p[1] - y;
  return dx * dx + dy * dy;
}

export function simplifyPoints(points: Point[], toleranceMm: number): Point[] {
  if (points.length <= 2) return points.slice();
  const sqTol = toleranceMm * toleranceMm;
  const keep = new Uint8Array(points.length);
  keep[0] = 1;
  keep[points.length - 1] = 1;
  const stack: [number, number][] = [[0, points.length - 1]];
  while (stack.length) {
    const [first, last] = stack.pop()!;
    let maxSq = sqTol;
    let index = -1;
    for (let i = first + 1; i < last; i++) {
      const d = sqSegDist(points[i]!, points[first]!, points[last]!);
      if (d > maxSq) {
        index = i;
        maxSq = d;
      }
    }
    if (index >= 0) {
      keep[index] = 1;
      stack.push([first, index], [index, last]);
    }
  }
  return points.filter((_, i) => keep[i] === 1);
}
