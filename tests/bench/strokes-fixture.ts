// Deterministic bench strokes: N strokes of about 60 points, spread over the
// four panels of the default page, wiggly like hand-drawn lines.
import { DEFAULT_PAGE_SPEC, panelRects } from '@/lib/print/geometry';
import type { Point, Stroke } from '@/lib/strokes/types';

export function benchStrokes(n: number, seed = 7, points = 60): Stroke[] {
  let s = seed >>> 0;
  const r = () => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
  const panels = panelRects(DEFAULT_PAGE_SPEC);
  return Array.from({ length: n }, (_, i) => {
    const panel = i % 4;
    const p = panels[panel]!;
    const x0 = p.x + r() * (p.w - 20);
    const y0 = p.y + 5 + r() * (p.h - 10);
    const pts: Point[] = Array.from({ length: points }, (_, k) => [
      Math.round((x0 + k * 0.3) * 100) / 100,
      Math.round((y0 + Math.sin(k / 6 + i) * 3) * 100) / 100,
      Math.round((0.3 + 0.5 * Math.abs(Math.sin(k / 10))) * 255) / 255,
    ]);
    return { id: `b${i}`, panel, tool: i % 9 === 0 ? 'tone' : 'pen', grey: i % 9 === 0 ? 40 : 100, size: i % 9 === 0 ? 4 : 0.6, points: pts };
  });
}
