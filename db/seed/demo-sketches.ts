// Invented rough thumbnails for the demo gags: a pier line, the teapot, Kettle
// peeking out, Mrs Brine as a few curves, tone patches. Deterministic (seeded),
// so the demo looks the same on every machine.
import { DEFAULT_PAGE_SPEC, panelRects } from '@/lib/print/geometry';
import type { Point, Room, Stroke } from '@/lib/strokes/types';

function rng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

function wobblyLine(r: () => number, x0: number, y0: number, x1: number, y1: number, n = 24, wobble = 0.4): Point[] {
  return Array.from({ length: n }, (_, i) => {
    const t = i / (n - 1);
    return [x0 + (x1 - x0) * t + (r() - 0.5) * wobble, y0 + (y1 - y0) * t + (r() - 0.5) * wobble, 0.35 + 0.4 * Math.sin(Math.PI * t)];
  });
}

function loop(r: () => number, cx: number, cy: number, rx: number, ry: number, n = 40, from = 0, to = Math.PI * 2): Point[] {
  return Array.from({ length: n }, (_, i) => {
    const a = from + ((to - from) * i) / (n - 1);
    const j = 1 + (r() - 0.5) * 0.05;
    return [cx + Math.cos(a) * rx * j, cy + Math.sin(a) * ry * j, 0.45 + 0.25 * Math.sin(a * 2)];
  });
}

/** One pass of a gag: something in every panel, varied by the seed. */
export function demoSketch(seed: number, passNumber: number): { strokes: Stroke[]; rooms: Room[] } {
  const r = rng(seed * 31 + passNumber);
  const panels = panelRects(DEFAULT_PAGE_SPEC);
  const strokes: Stroke[] = [];
  const rooms: Room[] = [];
  let k = 0;
  const add = (panel: number, tool: 'pen' | 'tone', points: Point[], size: number, grey = 100) =>
    strokes.push({ id: `d${seed}p${passNumber}s${k++}`, panel, tool, grey, size, points });
  panels.forEach((p, i) => {
    const horizon = p.y + p.h * (0.62 + (r() - 0.5) * 0.1);
    add(i, 'pen', wobblyLine(r, p.x + 1, horizon, p.x + p.w - 1, horizon + (r() - 0.5) * 2), 0.6);
    // The teapot, seen from the side, with its spout.
    const tx = p.x + p.w * (0.3 + r() * 0.35);
    const ty = horizon - 7;
    add(i, 'pen', loop(r, tx, ty, 9, 7), 0.7);
    add(i, 'pen', wobblyLine(r, tx + 8, ty - 1, tx + 15, ty - 6, 10), 0.6);
    add(i, 'pen', loop(r, tx - 9, ty, 3.5, 4, 20, Math.PI / 2, (3 * Math.PI) / 2), 0.5);
    // Kettle: two eye stalks at the spout or lid, more of him as the beats go on.
    for (let e = 0; e < 2; e++) add(i, 'pen', wobblyLine(r, tx - 2 + e * 3, ty - 7, tx - 2 + e * 3 + (r() - 0.5) * 2, ty - 11, 6, 0.2), 0.4);
    if (i >= 2 || passNumber > 1) add(i, 'pen', loop(r, tx - 2, ty - 4, 4, 2.5, 24), 0.5);
    // Mrs Brine: a gull's wing curves in the sky.
    if (i !== 0) {
      const gx = p.x + p.w * (0.6 + r() * 0.25);
      const gy = p.y + p.h * (0.2 + r() * 0.15);
      add(i, 'pen', loop(r, gx - 3, gy, 3, 1.6, 14, Math.PI, 2 * Math.PI), 0.5);
      add(i, 'pen', loop(r, gx + 3, gy, 3, 1.6, 14, Math.PI, 2 * Math.PI), 0.5);
    }
    // Sea and shadow in tone.
    add(i, 'tone', wobblyLine(r, p.x + 2, horizon + 5, p.x + p.w - 2, horizon + 5, 12, 0.8), 5, 20);
    if (i === 2) add(i, 'tone', wobblyLine(r, p.x + 4, p.y + 8, p.x + p.w - 6, p.y + 10, 12, 1), 8, 40);
  });
  if (passNumber > 1) {
    const p = panels[3]!;
    rooms.push({ id: `d${seed}p${passNumber}r0`, panel: 3, shape: 'ellipse', x: p.x + 3, y: p.y + 3, w: 24, h: 11 });
  }
  return { strokes, rooms };
}
