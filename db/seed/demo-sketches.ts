// Invented rough thumbnails for the demo gags, drawn as strokes from a small
// vocabulary of props (pier, teapot, Kettle, Mrs Brine, a rival crab, rain, sun…)
// placed per gag and per beat (demo-scenes.ts), so each gag's passes show its own premise. A first
// pass is loose (fewer props, shakier lines); later passes add the rest, frame the
// turn closer and reserve balloon room. Deterministic (seeded by the gag's id).
import { DEFAULT_PAGE_SPEC, panelRects } from '@/lib/print/geometry';
import type { Point, Room, Stroke } from '@/lib/strokes/types';
import { DEFAULT_SCENE, SCENES } from './demo-scenes';

function rng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

const hash = (text: string) => [...text].reduce((h, c) => (Math.imul(h, 31) + c.charCodeAt(0)) >>> 0, 7);

export function demoSketch(gagId: string, passNumber: number): { strokes: Stroke[]; rooms: Room[] } {
  const r = rng(hash(gagId) * 31 + passNumber);
  const scene = SCENES[gagId] ?? DEFAULT_SCENE;
  const panels = panelRects(DEFAULT_PAGE_SPEC);
  const strokes: Stroke[] = [];
  const rooms: Room[] = [];
  let n = 0;
  // A first pass is a scribble: shakier, and only the props that tell the beat.
  const rough = passNumber === 1;
  const shake = rough ? 0.9 : 0.35;

  panels.forEach((p, panel) => {
    const add = (points: Point[], size: number, tool: 'pen' | 'tone' = 'pen', grey = 100) => {
      // Keep every point inside the panel: the demo must look drawn in it.
      const inside = points.map(
        ([x, y, pr]) => [Math.min(p.x + p.w - 0.5, Math.max(p.x + 0.5, x)), Math.min(p.y + p.h - 0.5, Math.max(p.y + 0.5, y)), pr] as Point,
      );
      strokes.push({ id: `${gagId}-p${passNumber}-s${n++}`, panel, tool, grey, size, points: inside });
    };
    const line = (x0: number, y0: number, x1: number, y1: number, steps = 16, size = 0.6) =>
      add(
        Array.from({ length: steps }, (_, i) => {
          const t = i / (steps - 1);
          return [x0 + (x1 - x0) * t + (r() - 0.5) * shake, y0 + (y1 - y0) * t + (r() - 0.5) * shake, 0.35 + 0.4 * Math.sin(Math.PI * t)] as Point;
        }),
        size,
      );
    const arc = (cx: number, cy: number, rx: number, ry: number, from = 0, to = Math.PI * 2, size = 0.6, steps = 28) =>
      add(
        Array.from({ length: steps }, (_, i) => {
          const a = from + ((to - from) * i) / (steps - 1);
          const j = 1 + (r() - 0.5) * (shake / 8);
          return [cx + Math.cos(a) * rx * j, cy + Math.sin(a) * ry * j, 0.45 + 0.25 * Math.sin(a * 2)] as Point;
        }),
        size,
      );
    const tone = (x0: number, y0: number, x1: number, y1: number, width: number, grey: number) =>
      add(
        Array.from({ length: 10 }, (_, i) => [x0 + ((x1 - x0) * i) / 9, y0 + ((y1 - y0) * i) / 9 + (r() - 0.5) * 0.6, 0.6] as Point),
        width,
        'tone',
        grey,
      );

    const beat = scene[panel] ?? [];
    // Later passes frame the turn closer.
    const zoom = passNumber >= 3 && panel === 2 ? 1.2 : 1;
    const props = rough ? beat.slice(0, 2) : beat;
    for (const [kind, u, v, k0 = 1] of props) {
      const k = k0 * zoom * (p.w / 68);
      const x = p.x + p.w * u;
      const y = p.y + p.h * v;
      switch (kind) {
        case 'pier':
          line(p.x + 1, y, p.x + p.w - 1, y + (r() - 0.5) * 1.5, 20);
          for (let i = 1; i < 6; i++) line(p.x + (p.w * i) / 6, y + 0.5, p.x + (p.w * i) / 6 + (r() - 0.5), y + 4, 4, 0.4);
          break;
        case 'sea':
          tone(p.x + 2, y, p.x + p.w - 2, y, 5, 20);
          break;
        case 'teapot':
        case 'teapot-side':
          if (kind === 'teapot') {
            arc(x, y, 9 * k, 7 * k);
            line(x + 8 * k, y - 1 * k, x + 15 * k, y - 6 * k, 8);
            arc(x - 9 * k, y, 3.5 * k, 4 * k, Math.PI / 2, (3 * Math.PI) / 2, 0.5, 16);
            arc(x, y - 7 * k, 4 * k, 1.5 * k, Math.PI, 2 * Math.PI, 0.5, 12);
          } else {
            arc(x, y, 7 * k, 9 * k);
            line(x - 1 * k, y - 8 * k, x - 6 * k, y - 15 * k, 8);
            arc(x + 7 * k, y, 4 * k, 3.5 * k, 0, Math.PI, 0.5, 16);
          }
          break;
        case 'kettle':
        case 'kettle-reach':
        case 'kettle-flat':
        case 'kettle-cheer': {
          const flat = kind === 'kettle-flat';
          arc(x, y, 4 * k, (flat ? 1.5 : 2.5) * k, Math.PI, 2 * Math.PI, 0.5, 16);
          line(x - 4 * k, y, x + 4 * k, y, 6, 0.5);
          for (const e of [-1, 1]) line(x + e * 1.2 * k, y - 2 * k, x + e * 1.6 * k, y - (flat ? 3 : 5.5) * k, 5, 0.4);
          if (kind === 'kettle-reach') line(x + 4 * k, y - 0.5 * k, x + 12 * k, y + 1 * k, 8, 0.5);
          if (kind === 'kettle-cheer') for (const e of [-1, 1]) line(x + e * 4 * k, y - 1 * k, x + e * 6 * k, y - 7 * k, 6, 0.5);
          break;
        }
        case 'gull':
          arc(x, y, 5 * k, 3.5 * k);
          arc(x - 4 * k, y - 4 * k, 2.2 * k, 2 * k);
          line(x - 6 * k, y - 4 * k, x - 9 * k, y - 3.5 * k, 5, 0.5);
          line(x - 1 * k, y + 3.2 * k, x - 1 * k, y + 7 * k, 4, 0.4);
          line(x + 1.5 * k, y + 3.2 * k, x + 1.5 * k, y + 7 * k, 4, 0.4);
          break;
        case 'gull-flying':
          arc(x - 3 * k, y, 3 * k, 1.6 * k, Math.PI, 2 * Math.PI, 0.5, 14);
          arc(x + 3 * k, y, 3 * k, 1.6 * k, Math.PI, 2 * Math.PI, 0.5, 14);
          break;
        case 'crab':
          arc(x, y, 5 * k, 3 * k, Math.PI, 2 * Math.PI, 0.6, 18);
          for (let i = -2; i <= 2; i++) line(x + i * 2 * k, y, x + i * 3 * k, y + 3.5 * k, 4, 0.4);
          break;
        case 'mussel':
          arc(x, y, 3 * k, 1.5 * k, 0, Math.PI * 2, 0.5, 16);
          break;
        case 'lid':
          arc(x, y, 8 * k, 3 * k, Math.PI, 2 * Math.PI, 0.7, 18);
          line(x, y - 3 * k, x, y + 8 * k, 6, 0.5);
          break;
        case 'rain':
          for (let i = 0; i < 9; i++) {
            const rx = p.x + 3 + r() * (p.w - 6);
            const ry = p.y + 3 + r() * p.h * 0.5;
            line(rx, ry, rx - 1, ry + 3, 3, 0.3);
          }
          break;
        case 'sun':
          arc(x, y, 4 * k, 4 * k);
          for (let i = 0; i < 8; i++) {
            const a = (i / 8) * Math.PI * 2;
            line(x + Math.cos(a) * 6 * k, y + Math.sin(a) * 6 * k, x + Math.cos(a) * 8.5 * k, y + Math.sin(a) * 8.5 * k, 3, 0.4);
          }
          break;
        case 'steam':
          for (let i = 0; i < 3; i++) arc(x + i * 2 * k, y - i * 4 * k, 2 * k, 1.5 * k, 0, Math.PI * 1.5, 0.4, 12);
          break;
        case 'shell':
          for (let i = 0; i < 4; i++) arc(x + i * 0.8 * k, y - i * 0.5 * k, (8 - i * 1.8) * k, (6 - i * 1.3) * k, Math.PI, 2.6 * Math.PI, 0.6, 22);
          break;
        case 'fish':
          arc(x, y, 5 * k, 2.2 * k);
          line(x + 5 * k, y, x + 8 * k, y - 2.5 * k, 4, 0.5);
          line(x + 5 * k, y, x + 8 * k, y + 2.5 * k, 4, 0.5);
          break;
        case 'eye':
          arc(x, y, 9 * k, 6 * k);
          arc(x, y, 3 * k, 3 * k);
          tone(x - 2 * k, y, x + 2 * k, y, 3 * k, 80);
          break;
        case 'fog':
          for (let i = 0; i < 3; i++) tone(p.x + 2, p.y + p.h * (0.25 + i * 0.2), p.x + p.w - 2, p.y + p.h * (0.3 + i * 0.2), 8, 20);
          break;
        case 'horn':
          line(x - 12 * k, y - 3 * k, x + 8 * k, y - 8 * k, 12, 0.8);
          line(x - 12 * k, y + 3 * k, x + 8 * k, y + 8 * k, 12, 0.8);
          arc(x + 8 * k, y, 2.5 * k, 8 * k, 0, Math.PI * 2, 0.7, 20);
          break;
        case 'cube':
          line(x - 3 * k, y - 3 * k, x + 3 * k, y - 3 * k, 5);
          line(x + 3 * k, y - 3 * k, x + 3 * k, y + 3 * k, 5);
          line(x + 3 * k, y + 3 * k, x - 3 * k, y + 3 * k, 5);
          line(x - 3 * k, y + 3 * k, x - 3 * k, y - 3 * k, 5);
          break;
        case 'wave':
          arc(x, y, 14 * k, 10 * k, Math.PI * 0.9, Math.PI * 2.2, 0.8, 30);
          tone(x - 14 * k, y + 8 * k, x + 12 * k, y + 6 * k, 6, 40);
          break;
        case 'cups':
          line(p.x + p.w * 0.15, y + 3, p.x + p.w * 0.85, y + 3, 12);
          for (let i = 0; i < 3; i++) arc(p.x + p.w * (0.3 + i * 0.2), y, 2.5 * k, 2 * k, 0, Math.PI, 0.5, 10);
          break;
        case 'post':
          line(x - 2 * k, y - 10 * k, x - 2 * k, y + 12 * k, 10, 0.7);
          line(x + 2 * k, y - 10 * k, x + 2 * k, y + 12 * k, 10, 0.7);
          break;
        case 'bulb':
          arc(x, y, 5 * k, 6 * k);
          line(x, y - 6 * k, x, p.y + 1, 6, 0.4);
          if (!rough) tone(x - 8 * k, y, x + 8 * k, y, 14 * k, 20);
          break;
        case 'moth':
          arc(x - 2.5 * k, y, 2.5 * k, 3.5 * k);
          arc(x + 2.5 * k, y, 2.5 * k, 3.5 * k);
          line(x - 0.5 * k, y - 3 * k, x - 2 * k, y - 6 * k, 4, 0.3);
          line(x + 0.5 * k, y - 3 * k, x + 2 * k, y - 6 * k, 4, 0.3);
          break;
        case 'candle':
          line(x - 2 * k, y, x - 2 * k, y + 10 * k, 6);
          line(x + 2 * k, y, x + 2 * k, y + 10 * k, 6);
          arc(x, y - 2.5 * k, 1.2 * k, 2.5 * k);
          break;
      }
    }
  });
  // From the second pass on, the payoff keeps room for a balloon (wordless gags still want a sound or a sign).
  if (passNumber > 1) {
    const p = panels[3]!;
    rooms.push({ id: `${gagId}-p${passNumber}-r0`, panel: 3, shape: 'ellipse', x: p.x + 3, y: p.y + 3, w: 24, h: 11 });
  }
  return { strokes, rooms };
}
