// Committed strokes kept as one offscreen bitmap per panel (shared/STROKES.md):
// a new stroke is drawn *into* its panel's bitmap, so showing it costs the same
// at 0 or 5,000 strokes; a removal or move re-rasters only its panel; zooming
// re-rasters once, after the gesture.
import type { PageSpec, Rect } from '@/lib/print/geometry';
import { panelRects } from '@/lib/print/geometry';
import { outlineOf, traceOutline } from '@/lib/strokes/outline';
import { type Stroke, greyToCss, strokeAlpha } from '@/lib/strokes/types';
import { traceFlat } from './outline-pack';
import { takeOutline } from './outline-prefetch';

/** Longest side of one panel bitmap, in device pixels. */
const MAX_SIDE = 4096;

type Cached = { stroke: Stroke; path: Path2D };

export class PanelRasters {
  readonly canvases: HTMLCanvasElement[];
  private rects: Rect[];
  /** Device pixels per mm in the bitmaps. */
  private pxPerMm = 1;
  private paths = new Map<string, Cached>();

  constructor(spec: PageSpec, doc: Document = document) {
    this.rects = panelRects(spec);
    this.canvases = this.rects.map(() => doc.createElement('canvas'));
  }

  get scale(): number {
    return this.pxPerMm;
  }

  /** Sets the bitmap resolution; the caller redraws everything afterwards. */
  setScale(pxPerMm: number) {
    const longest = Math.max(...this.rects.map((r) => Math.max(r.w, r.h)));
    this.pxPerMm = Math.max(0.5, Math.min(pxPerMm, MAX_SIDE / longest));
    this.rects.forEach((r, i) => {
      const c = this.canvases[i]!;
      c.width = Math.max(1, Math.round(r.w * this.pxPerMm));
      c.height = Math.max(1, Math.round(r.h * this.pxPerMm));
    });
  }

  /** The outline as a Path2D in mm, computed once per stroke version. */
  pathOf(stroke: Stroke): Path2D {
    const hit = this.paths.get(stroke.id);
    if (hit && hit.stroke === stroke) return hit.path;
    const path = new Path2D();
    const ready = takeOutline(stroke);
    if (ready) traceFlat(path, ready);
    else traceOutline(path, outlineOf(stroke));
    this.paths.set(stroke.id, { stroke, path });
    return path;
  }

  forget(id: string) {
    this.paths.delete(id);
  }

  private ctxFor(panel: number): CanvasRenderingContext2D | null {
    const r = this.rects[panel];
    const ctx = this.canvases[panel]?.getContext('2d') ?? null;
    if (!r || !ctx) return null;
    ctx.setTransform(this.pxPerMm, 0, 0, this.pxPerMm, -r.x * this.pxPerMm, -r.y * this.pxPerMm);
    return ctx;
  }

  /** Draws one stroke on top of its panel's bitmap: O(1) in the number of strokes. */
  drawStroke(stroke: Stroke) {
    const ctx = this.ctxFor(stroke.panel);
    if (!ctx) return;
    ctx.globalAlpha = strokeAlpha(stroke.tool);
    ctx.fillStyle = greyToCss(stroke.grey);
    ctx.fill(this.pathOf(stroke));
    ctx.globalAlpha = 1;
  }

  /** Clears a panel and draws its strokes again, in order (one transform for the lot). */
  redrawPanel(panel: number, strokes: Iterable<Stroke>) {
    const c = this.canvases[panel];
    const ctx = c?.getContext('2d');
    if (!c || !ctx) return;
    ctx.setTransform(1, 0, 0, 1, 0, 0);
    ctx.clearRect(0, 0, c.width, c.height);
    this.ctxFor(panel);
    for (const s of strokes) {
      if (s.panel !== panel) continue;
      ctx.globalAlpha = strokeAlpha(s.tool);
      ctx.fillStyle = greyToCss(s.grey);
      ctx.fill(this.pathOf(s));
    }
    ctx.globalAlpha = 1;
  }

  redrawAll(strokes: Iterable<Stroke>) {
    const byPanel: Stroke[][] = [[], [], [], []];
    for (const s of strokes) byPanel[s.panel]?.push(s);
    byPanel.forEach((list, i) => this.redrawPanel(i, list));
  }
}
