// Runs inside Chromium (bundled by tests/bench/run.ts). Every figure is a
// ratio of two timings taken side by side in this page, in this run.
import Konva from 'konva';
import { PanelRasters } from '@/components/editor/panel-rasters';
import { DEFAULT_PAGE_SPEC, panelRects } from '@/lib/print/geometry';
import { pointsBounds, rectsOverlap, strokeTouches } from '@/lib/strokes/hit';
import { Outbox } from '@/lib/strokes/outbox';
import { applyOp, docFrom, strokesOfPanel } from '@/lib/strokes/pass-model';
import { simplifyPoints } from '@/lib/strokes/simplify';
import { type Stroke, greyToCss, strokeAlpha } from '@/lib/strokes/types';
import { benchStrokes } from './strokes-fixture';

const SCALE = 8; // device px per mm, a comfortable working zoom
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const flush = (c: HTMLCanvasElement) => c.getContext('2d')!.getImageData(0, 0, 1, 1); // forces the raster

function time(fn: () => void, runs: number): number {
  const xs: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    fn();
    xs.push(performance.now() - t);
  }
  return median(xs);
}

function plainFill(strokes: Stroke[], paths: Map<string, Path2D>, canvas: HTMLCanvasElement) {
  const ctx = canvas.getContext('2d')!;
  ctx.setTransform(1, 0, 0, 1, 0, 0);
  ctx.clearRect(0, 0, canvas.width, canvas.height);
  const panels = panelRects(DEFAULT_PAGE_SPEC);
  ctx.setTransform(SCALE, 0, 0, SCALE, 3 * SCALE, 3 * SCALE);
  for (let p = 0; p < 4; p++) {
    const r = panels[p]!;
    ctx.save();
    ctx.beginPath();
    ctx.rect(r.x, r.y, r.w, r.h);
    ctx.clip();
    for (const s of strokes) {
      if (s.panel !== p) continue;
      ctx.globalAlpha = strokeAlpha(s.tool);
      ctx.fillStyle = greyToCss(s.grey);
      ctx.fill(paths.get(s.id)!);
    }
    ctx.restore();
  }
  flush(canvas);
}

function stage(rasters: PanelRasters) {
  const el = document.createElement('div');
  document.body.appendChild(el);
  const st = new Konva.Stage({ container: el, width: 1000, height: 800 });
  const layer = new Konva.Layer({ listening: false, scaleX: 5, scaleY: 5, x: 20, y: 20 });
  panelRects(DEFAULT_PAGE_SPEC).forEach((r, i) =>
    layer.add(new Konva.Image({ image: rasters.canvases[i]!, x: r.x, y: r.y, width: r.w, height: r.h })),
  );
  st.add(layer);
  layer.draw();
  return { st, layer };
}

function setup(n: number) {
  const strokes = benchStrokes(n);
  const rasters = new PanelRasters(DEFAULT_PAGE_SPEC);
  rasters.setScale(SCALE);
  for (const s of strokes) rasters.pathOf(s); // outlines computed once, as the editor does
  rasters.redrawAll(strokes);
  const doc = docFrom(strokes, []);
  const { st, layer } = stage(rasters);
  const store = new Map<string, string>();
  const outbox = new Outbox(
    { getItem: (k) => store.get(k) ?? null, setItem: (k, v) => void store.set(k, v), removeItem: (k) => void store.delete(k) },
    'bench',
    (() => {
      let i = 0;
      return () => `batch${i++}`;
    })(),
  );
  return { strokes, rasters, doc, st, layer, outbox };
}

export function runClientBench() {
  const results: Record<string, number> = {};

  // 1. Full re-raster at 5,000 strokes: our panel bitmaps against plain Canvas 2D, same outlines.
  const big = setup(5000);
  const paths = new Map(big.strokes.map((s) => [s.id, big.rasters.pathOf(s)]));
  const plain = document.createElement('canvas');
  plain.width = Math.round(156 * SCALE);
  plain.height = Math.round(156 * SCALE);
  // Alternate the two so that machine noise falls on both alike.
  const plainRuns: number[] = [];
  const oursRuns: number[] = [];
  for (let i = 0; i < 7; i++) {
    plainRuns.push(time(() => plainFill(big.strokes, paths, plain), 1));
    oursRuns.push(
      time(() => {
        big.rasters.redrawAll(big.strokes);
        big.rasters.canvases.forEach(flush);
      }, 1),
    );
  }
  const plainMs = median(plainRuns);
  const oursMs = median(oursRuns);
  results.fullRasterPlainMs = plainMs;
  results.fullRasterOursMs = oursMs;

  // 2. One new stroke, pointer-up to committed, at 5,000 strokes against none.
  const empty = setup(0);
  const fresh = benchStrokes(400, 99);
  let k = 0;
  const commitOne = (env: ReturnType<typeof setup>) => () => {
    const raw = fresh[k++ % fresh.length]!;
    const stroke = { ...raw, id: `new${k}`, points: simplifyPoints(raw.points, 0.02) };
    applyOp(env.doc, { op: 'add', stroke });
    env.outbox.push({ op: 'add', stroke });
    env.rasters.drawStroke(stroke);
    env.layer.batchDraw();
    env.layer.draw();
    flush(env.rasters.canvases[stroke.panel]!);
    env.outbox.seal();
    env.outbox.ack(env.outbox.next()!.batchId);
  };
  // Interleave the two so machine noise hits both alike.
  const bigC: number[] = [];
  const emptyC: number[] = [];
  for (let i = 0; i < 60; i++) {
    emptyC.push(time(commitOne(empty), 1));
    bigC.push(time(commitOne(big), 1));
  }
  results.commitEmptyMs = median(emptyC);
  results.commitBigMs = median(bigC);

  // 3. One frame of panning and zooming.
  const frame = (env: ReturnType<typeof setup>) => () => {
    env.layer.x(env.layer.x() + 3);
    env.layer.scale({ x: env.layer.scaleX() * 1.01, y: env.layer.scaleY() * 1.01 });
    env.layer.draw();
    env.layer.getCanvas()._canvas.getContext('2d')!.getImageData(0, 0, 1, 1);
  };
  const panBig: number[] = [];
  const panEmpty: number[] = [];
  for (let i = 0; i < 60; i++) {
    panEmpty.push(time(frame(empty), 1));
    panBig.push(time(frame(big), 1));
  }
  results.panEmptyMs = median(panEmpty);
  results.panBigMs = median(panBig);

  // 4. Erasing one stroke: which panels get re-rastered.
  const target = big.strokes[123]!;
  const [ex, ey] = target.points[30]!;
  const hits: Stroke[] = [];
  for (const s of big.doc.strokes.values()) {
    if (!rectsOverlap(pointsBounds(s.points, s.size / 2), { x: ex - 0.1, y: ey - 0.1, w: 0.2, h: 0.2 })) continue;
    if (strokeTouches(s.points, s.size, ex, ey, 0.1)) hits.push(s);
  }
  const touched = new Set<number>();
  for (const h of hits) applyOp(big.doc, { op: 'remove', strokeId: h.id }, touched);
  const t0 = performance.now();
  for (const p of touched) big.rasters.redrawPanel(p, strokesOfPanel(big.doc, p));
  big.rasters.canvases.forEach(flush);
  results.eraseMs = performance.now() - t0;
  results.erasePanels = touched.size;
  results.eraseHits = hits.length;

  big.st.destroy();
  empty.st.destroy();
  return results;
}

(window as unknown as { quadrilleBench: unknown }).quadrilleBench = { runClientBench };
