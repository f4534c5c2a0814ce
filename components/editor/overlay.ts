// Draws what sits over the stroke bitmaps and changes with every pointer move:
// the stroke under the pen, the lasso, a room being drawn, the selection (moved
// while dragged), strokes the findings flag, and the eraser's ring. Units are mm
// (the layer carries the view transform); `px` is one screen pixel in mm.
import type { Rect } from '@/lib/print/geometry';
import { outlineOf, traceOutline } from '@/lib/strokes/outline';
import { type Stroke, greyToCss, strokeAlpha } from '@/lib/strokes/types';
import { type Gesture, unionBounds } from './gestures';

export type OverlayState = {
  gesture: Gesture | null;
  panels: Rect[];
  penSize: number;
  toneSize: number;
  toneGrey: number;
  selection: Stroke[];
  flagged: Stroke[];
  eraserRing: { x: number; y: number; r: number } | null;
  pathOf: (s: Stroke) => Path2D;
  px: number;
};

const INK = '#1d4e6e';
const WARN = '#b8321f';

export function drawOverlay(c: CanvasRenderingContext2D, o: OverlayState) {
  const g = o.gesture;
  const px = o.px;
  if (g?.kind === 'draw' && g.points.length) {
    const r = o.panels[g.panel]!;
    const tone = g.tool === 'tone';
    c.save();
    c.beginPath();
    c.rect(r.x, r.y, r.w, r.h);
    c.clip();
    c.beginPath();
    traceOutline(c, outlineOf({ tool: g.tool, size: tone ? o.toneSize : o.penSize, points: g.points }, false));
    c.globalAlpha = strokeAlpha(g.tool);
    c.fillStyle = greyToCss(tone ? o.toneGrey : 100);
    c.fill();
    c.restore();
  }
  if (g?.kind === 'lasso' && g.path.length > 1) {
    c.save();
    c.beginPath();
    g.path.forEach(([x, y], i) => (i ? c.lineTo(x, y) : c.moveTo(x, y)));
    c.closePath();
    c.fillStyle = 'rgba(29,78,110,0.08)';
    c.fill();
    c.setLineDash([4 * px, 3 * px]);
    c.lineWidth = px;
    c.strokeStyle = INK;
    c.stroke();
    c.restore();
  }
  if (g?.kind === 'room') {
    c.save();
    c.setLineDash([4 * px, 3 * px]);
    c.lineWidth = 1.5 * px;
    c.strokeStyle = INK;
    c.strokeRect(Math.min(g.start.x, g.end.x), Math.min(g.start.y, g.end.y), Math.abs(g.end.x - g.start.x), Math.abs(g.end.y - g.start.y));
    c.restore();
  }
  if (o.selection.length) {
    const dx = g?.kind === 'drag-selection' ? g.dx : 0;
    const dy = g?.kind === 'drag-selection' ? g.dy : 0;
    c.save();
    c.translate(dx, dy);
    c.fillStyle = 'rgba(29,78,110,0.55)';
    for (const s of o.selection) c.fill(o.pathOf(s));
    const b = unionBounds(o.selection)!;
    c.setLineDash([5 * px, 4 * px]);
    c.lineWidth = px;
    c.strokeStyle = INK;
    c.strokeRect(b.x, b.y, b.w, b.h);
    c.restore();
  }
  if (o.flagged.length) {
    c.save();
    c.strokeStyle = WARN;
    c.lineWidth = 2 * px;
    for (const s of o.flagged) c.stroke(o.pathOf(s));
    c.restore();
  }
  if (o.eraserRing) {
    c.save();
    c.beginPath();
    c.arc(o.eraserRing.x, o.eraserRing.y, o.eraserRing.r, 0, Math.PI * 2);
    c.lineWidth = px;
    c.strokeStyle = WARN;
    c.stroke();
    c.restore();
  }
}
