// Stroke outlines as flat arrays, to move them between threads without copying: what the outline
// worker computes (outline-worker.ts) and the editor's bitmaps draw (outline-prefetch.ts).
import { outlineOf } from '@/lib/strokes/outline';
import type { Stroke } from '@/lib/strokes/types';

export type OutlineChunk = {
  ids: string[];
  /** Per stroke: how many polygons; per polygon: how many points; the points' x, y in mm, all in a row. */
  polygons: Uint32Array;
  points: Uint32Array;
  coords: Float32Array;
  /** Per stroke: its first point and its number of points, to know the stroke the outline belongs to. */
  firsts: Float64Array;
  counts: Uint32Array;
};

/** One stroke's outline as flat arrays: each polygon's number of points, then every x, y in a row (mm). */
export type FlatOutline = { points: Uint32Array; coords: Float32Array };
export type KeptOutline = FlatOutline & { x: number; y: number; count: number };

export function packOutlines(strokes: Stroke[]): OutlineChunk {
  const outlines = strokes.map((s) => outlineOf(s));
  let polyCount = 0;
  let pointCount = 0;
  for (const o of outlines) {
    polyCount += o.length;
    for (const p of o) pointCount += p.length;
  }
  const chunk: OutlineChunk = {
    ids: strokes.map((s) => s.id),
    polygons: new Uint32Array(strokes.length),
    points: new Uint32Array(polyCount),
    coords: new Float32Array(pointCount * 2),
    firsts: new Float64Array(strokes.length * 2),
    counts: new Uint32Array(strokes.length),
  };
  let pi = 0;
  let ci = 0;
  outlines.forEach((o, i) => {
    const s = strokes[i]!;
    chunk.polygons[i] = o.length;
    chunk.firsts[2 * i] = s.points[0]?.[0] ?? 0;
    chunk.firsts[2 * i + 1] = s.points[0]?.[1] ?? 0;
    chunk.counts[i] = s.points.length;
    for (const p of o) {
      chunk.points[pi++] = p.length;
      for (const [x, y] of p) {
        chunk.coords[ci++] = x;
        chunk.coords[ci++] = y;
      }
    }
  });
  return chunk;
}

/** Each stroke's outline of a chunk, as views into its arrays (nothing copied). */
export function unpackOutlines(c: OutlineChunk, into: Map<string, KeptOutline>): void {
  let pi = 0;
  let ci = 0;
  c.ids.forEach((id, i) => {
    const polys = c.polygons[i]!;
    let n = 0;
    for (let k = 0; k < polys; k++) n += c.points[pi + k]!;
    into.set(id, {
      points: c.points.subarray(pi, pi + polys),
      coords: c.coords.subarray(ci, ci + 2 * n),
      x: c.firsts[2 * i]!,
      y: c.firsts[2 * i + 1]!,
      count: c.counts[i]!,
    });
    pi += polys;
    ci += 2 * n;
  });
}

/** The kept outline if it was computed for this very stroke (same first point and number of points). */
export const outlineFits = (k: KeptOutline, stroke: Stroke) => {
  const first = stroke.points[0];
  return !!first && k.count === stroke.points.length && k.x === first[0] && k.y === first[1];
};

/** Lays a flat outline into a path, as traceOutline does for a nested one. */
export function traceFlat(ctx: { moveTo(x: number, y: number): void; lineTo(x: number, y: number): void; closePath(): void }, o: FlatOutline) {
  let at = 0;
  for (const n of o.points) {
    if (n >= 3) {
      ctx.moveTo(o.coords[at]!, o.coords[at + 1]!);
      for (let i = 1; i < n; i++) ctx.lineTo(o.coords[at + 2 * i]!, o.coords[at + 2 * i + 1]!);
      ctx.closePath();
    }
    at += 2 * n;
  }
}
