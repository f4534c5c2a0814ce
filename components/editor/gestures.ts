// The editor's pointer gestures as a pure state machine: the tool and its
// settings, the pass's strokes, and pointer events already in page millimetres
// go in; the gesture in progress and what it does (operations to commit, undo
// entries, a new selection, a pin, a pan) come out. No canvas and no React, so
// every tool × pointer sequence is unit-tested directly (tests/unit/gestures.test.ts).
// Point arrays grow in place: a stroke of thousands of samples is not copied per event.
import { type PageSpec, type Rect, bleedBox, panelAt, panelRects } from '@/lib/print/geometry';
import { pointsBounds, rectsOverlap, strokeInLasso, strokeTouches } from '@/lib/strokes/hit';
import { eraseAlong } from '@/lib/strokes/erase';
import { simplifyPoints } from '@/lib/strokes/simplify';
import type { Op, Point, Room, RoomShape, Stroke } from '@/lib/strokes/types';
import type { Tool } from './tools';
import { type UndoEntry, addedStrokes, cutStrokes, movedStrokes, removedStrokes, roomChanged } from './undo';

export type Gesture =
  | { kind: 'draw'; pointerId: number; panel: number; points: Point[]; tool: 'pen' | 'tone' }
  | { kind: 'erase'; pointerId: number; removed: Stroke[] }
  /** The cutting eraser: `removed` are the pass's strokes it cut, `pieces` what is left of them now. */
  | { kind: 'cut'; pointerId: number; last: { x: number; y: number }; removed: Stroke[]; pieces: Stroke[] }
  | { kind: 'lasso'; pointerId: number; path: [number, number][] }
  | { kind: 'drag-selection'; pointerId: number; start: { x: number; y: number }; dx: number; dy: number; bounds: Rect }
  | { kind: 'room'; pointerId: number; panel: number; start: { x: number; y: number }; end: { x: number; y: number } }
  | { kind: 'pan'; pointerId: number; last: { x: number; y: number } };

export type PointerInput = {
  pointerId: number;
  pointerType: string;
  button: number;
  /** Where on the page, in mm. */
  x: number;
  y: number;
  /** Where on the screen, in CSS pixels (for panning). */
  sx: number;
  sy: number;
  pressure: number;
  /** A move's coalesced samples in mm, oldest first; the event alone when absent. */
  samples?: { x: number; y: number; pressure: number }[];
  /** A balloon room or lightbox under the pointer: its own handles take the gesture. */
  over?: 'room' | 'lightbox' | null;
};

export type Settings = {
  tool: Tool;
  canDraw: boolean;
  penOnly: boolean;
  penSize: number;
  toneSize: number;
  toneGrey: number;
  roomShape: RoomShape;
  /** The eraser cuts strokes where it passes (true) or takes whole strokes away (false). */
  eraserCuts?: boolean;
};

export type Scene = {
  spec: PageSpec;
  strokes: () => Iterable<Stroke>;
  /** The strokes selected now. */
  selection: Stroke[];
  /** The eraser's reach in mm at the current zoom. */
  eraserRadius: number;
  newId: () => string;
};

/** What a pointer event does beyond changing the gesture. */
export type Effects = {
  /** Operations to commit now. */
  ops?: Op[];
  /** A finished stroke: draw it into its panel's bitmap (it is also in `ops`). */
  drawn?: Stroke;
  /** Strokes the eraser just took away (also in `ops`): re-raster their panels. */
  erased?: Stroke[];
  undo?: UndoEntry;
  /** A new stroke selection (lasso). */
  select?: string[];
  /** The balloon room to select (null: none). */
  selectRoom?: string | null;
  /** Clicked beside any lightbox while arranging: drop the choice. */
  clearLightbox?: boolean;
  pin?: { panel: number; x: number; y: number };
  /** Move the view by this many screen pixels. */
  panBy?: { dx: number; dy: number };
  /** Keep the pointer's events until it is released. */
  capture?: boolean;
};

export type Step = { gesture: Gesture | null; effects: Effects };

const clampToBox = (p: { x: number; y: number }, b: Rect) => ({
  x: Math.min(b.x + b.w, Math.max(b.x, p.x)),
  y: Math.min(b.y + b.h, Math.max(b.y, p.y)),
});
const r2 = (n: number) => Math.round(n * 100) / 100;

/** The panel under a point, or the nearest one when the point is in a gutter or the margin. */
export function nearestPanel(spec: PageSpec, x: number, y: number): number {
  const at = panelAt(spec, x, y);
  if (at !== null) return at;
  let best = 0;
  let bestD = Infinity;
  panelRects(spec).forEach((r, i) => {
    const d = (Math.max(r.x, Math.min(x, r.x + r.w)) - x) ** 2 + (Math.max(r.y, Math.min(y, r.y + r.h)) - y) ** 2;
    if (d < bestD) {
      bestD = d;
      best = i;
    }
  });
  return best;
}

export function unionBounds(strokes: Stroke[]): Rect | null {
  if (strokes.length === 0) return null;
  return pointsBounds(
    strokes.flatMap((s) => s.points),
    Math.max(...strokes.map((s) => s.size)) / 2,
  );
}

function eraseAt(scene: Scene, g: Extract<Gesture, { kind: 'erase' }>, x: number, y: number): Effects {
  const r = scene.eraserRadius;
  const probe = { x: x - r, y: y - r, w: 2 * r, h: 2 * r };
  const gone = new Set(g.removed.map((s) => s.id));
  const hits: Stroke[] = [];
  for (const s of scene.strokes()) {
    if (gone.has(s.id) || !rectsOverlap(pointsBounds(s.points, s.size / 2), probe)) continue;
    if (strokeTouches(s.points, s.size, x, y, r)) hits.push(s);
  }
  if (hits.length === 0) return {};
  g.removed.push(...hits);
  return { ops: hits.map((s) => ({ op: 'remove', strokeId: s.id })), erased: hits };
}

/** The cutting eraser from its last place to (x, y): each stroke it meets is removed and its pieces added. */
function cutAlong(scene: Scene, g: Extract<Gesture, { kind: 'cut' }>, x: number, y: number): Effects {
  const ops = eraseAlong(
    [...scene.strokes()],
    [
      [g.last.x, g.last.y],
      [x, y],
    ],
    scene.eraserRadius,
    scene.newId,
  );
  g.last = { x, y };
  if (ops.length === 0) return {};
  const byId = new Map<string, Stroke>();
  for (const s of scene.strokes()) byId.set(s.id, s);
  const cut: Stroke[] = [];
  for (const op of ops) {
    if (op.op === 'remove') {
      const i = g.pieces.findIndex((p) => p.id === op.strokeId);
      // A piece this same gesture made and now cuts again is not one of the pass's own strokes.
      if (i >= 0) g.pieces.splice(i, 1);
      else if (byId.has(op.strokeId)) g.removed.push(byId.get(op.strokeId)!);
      if (byId.has(op.strokeId)) cut.push(byId.get(op.strokeId)!);
    } else if (op.op === 'add') g.pieces.push(op.stroke);
  }
  return { ops, erased: cut };
}

const pressureOf = (pointerType: string, pressure: number) => (pointerType === 'mouse' ? 0.5 : pressure || 0.5);

export function pointerDown(settings: Settings, scene: Scene, e: PointerInput): Step {
  const { tool, canDraw } = settings;
  const none: Step = { gesture: null, effects: {} };
  if (e.pointerType === 'touch' && settings.penOnly && tool !== 'pan') return none; // a resting palm draws nothing
  const panels = panelRects(scene.spec);
  if (tool === 'pin' && e.button === 0) {
    const panel = nearestPanel(scene.spec, e.x, e.y);
    const p = clampToBox(e, panels[panel]!);
    return { gesture: null, effects: { pin: { panel, x: Math.round(p.x * 10) / 10, y: Math.round(p.y * 10) / 10 } } };
  }
  if (tool === 'lightbox' && canDraw && e.button === 0) {
    return e.over === 'lightbox' ? none : { gesture: null, effects: { clearLightbox: true } };
  }
  if (e.button === 1 || tool === 'pan' || !canDraw) {
    return { gesture: { kind: 'pan', pointerId: e.pointerId, last: { x: e.sx, y: e.sy } }, effects: { capture: true } };
  }
  if (e.button !== 0 && e.pointerType === 'mouse') return none;
  const bleed = bleedBox(scene.spec);
  const at = clampToBox(e, bleed);
  switch (tool) {
    case 'pen':
    case 'tone':
      return {
        gesture: {
          kind: 'draw',
          pointerId: e.pointerId,
          panel: nearestPanel(scene.spec, at.x, at.y),
          points: [[at.x, at.y, pressureOf(e.pointerType, e.pressure)]],
          tool,
        },
        effects: { capture: true },
      };
    case 'eraser': {
      if (settings.eraserCuts) {
        const g: Gesture = { kind: 'cut', pointerId: e.pointerId, last: { x: e.x, y: e.y }, removed: [], pieces: [] };
        return { gesture: g, effects: { ...cutAlong(scene, g, e.x, e.y), capture: true } };
      }
      const g: Gesture = { kind: 'erase', pointerId: e.pointerId, removed: [] };
      return { gesture: g, effects: { ...eraseAt(scene, g, e.x, e.y), capture: true } };
    }
    case 'lasso': {
      const b = unionBounds(scene.selection);
      if (b && e.x >= b.x && e.x <= b.x + b.w && e.y >= b.y && e.y <= b.y + b.h) {
        return {
          gesture: { kind: 'drag-selection', pointerId: e.pointerId, start: { x: e.x, y: e.y }, dx: 0, dy: 0, bounds: b },
          effects: { capture: true },
        };
      }
      return { gesture: { kind: 'lasso', pointerId: e.pointerId, path: [[e.x, e.y]] }, effects: { select: [], capture: true } };
    }
    case 'room': {
      if (e.over === 'room') return none;
      const panel = nearestPanel(scene.spec, e.x, e.y);
      const p = clampToBox(e, panels[panel]!);
      return { gesture: { kind: 'room', pointerId: e.pointerId, panel, start: p, end: p }, effects: { selectRoom: null, capture: true } };
    }
    default:
      return none;
  }
}

export function pointerMove(g: Gesture | null, scene: Scene, e: PointerInput): Step {
  if (!g || g.pointerId !== e.pointerId) return { gesture: g, effects: {} };
  const bleed = bleedBox(scene.spec);
  switch (g.kind) {
    case 'pan': {
      const panBy = { dx: e.sx - g.last.x, dy: e.sy - g.last.y };
      return { gesture: { ...g, last: { x: e.sx, y: e.sy } }, effects: { panBy } };
    }
    case 'draw':
      for (const s of e.samples?.length ? e.samples : [e]) {
        const p = clampToBox(s, bleed);
        g.points.push([p.x, p.y, pressureOf(e.pointerType, s.pressure)]);
      }
      return { gesture: g, effects: {} };
    case 'erase':
      return { gesture: g, effects: eraseAt(scene, g, e.x, e.y) };
    case 'cut':
      return { gesture: g, effects: cutAlong(scene, g, e.x, e.y) };
    case 'lasso':
      g.path.push([e.x, e.y]);
      return { gesture: g, effects: {} };
    case 'drag-selection': {
      // The selection stays inside the bleed box.
      const dx = Math.min(bleed.x + bleed.w - (g.bounds.x + g.bounds.w), Math.max(bleed.x - g.bounds.x, e.x - g.start.x));
      const dy = Math.min(bleed.y + bleed.h - (g.bounds.y + g.bounds.h), Math.max(bleed.y - g.bounds.y, e.y - g.start.y));
      return { gesture: { ...g, dx, dy }, effects: {} };
    }
    case 'room':
      return { gesture: { ...g, end: clampToBox(e, panelRects(scene.spec)[g.panel]!) }, effects: {} };
  }
}

/** The pointer was released (or the gesture cancelled): what the gesture ends with. */
export function pointerUp(g: Gesture | null, settings: Settings, scene: Scene, e: Pick<PointerInput, 'pointerId'>): Step {
  if (!g || g.pointerId !== e.pointerId) return { gesture: g, effects: {} };
  switch (g.kind) {
    case 'draw': {
      const tone = g.tool === 'tone';
      const stroke: Stroke = {
        id: scene.newId(),
        panel: g.panel,
        tool: g.tool,
        grey: tone ? settings.toneGrey : 100,
        size: tone ? settings.toneSize : settings.penSize,
        points: simplifyPoints(g.points, 0.02),
      };
      return { gesture: null, effects: { ops: [{ op: 'add', stroke }], drawn: stroke, undo: addedStrokes([stroke]) } };
    }
    case 'erase':
      return { gesture: null, effects: g.removed.length ? { undo: removedStrokes(g.removed) } : {} };
    case 'cut':
      return { gesture: null, effects: g.removed.length ? { undo: cutStrokes(g.removed, g.pieces) } : {} };
    case 'lasso': {
      const picked: string[] = [];
      if (g.path.length > 2) for (const s of scene.strokes()) if (strokeInLasso(s.points, g.path)) picked.push(s.id);
      return { gesture: null, effects: { select: picked } };
    }
    case 'drag-selection': {
      if (Math.abs(g.dx) <= 1e-3 && Math.abs(g.dy) <= 1e-3) return { gesture: null, effects: {} };
      const ids = scene.selection.map((s) => s.id);
      const dx = r2(g.dx);
      const dy = r2(g.dy);
      return { gesture: null, effects: { ops: [{ op: 'move', strokeIds: ids, dx, dy }], undo: movedStrokes(ids, dx, dy) } };
    }
    case 'room': {
      const w = Math.abs(g.end.x - g.start.x);
      const h = Math.abs(g.end.y - g.start.y);
      if (w <= 2 || h <= 2) return { gesture: null, effects: {} };
      const room: Room = {
        id: scene.newId(),
        panel: g.panel,
        shape: settings.roomShape,
        x: Math.min(g.start.x, g.end.x),
        y: Math.min(g.start.y, g.end.y),
        w,
        h,
      };
      return { gesture: null, effects: { ops: [{ op: 'room', room }], undo: roomChanged(null, room), selectRoom: room.id } };
    }
    case 'pan':
      return { gesture: null, effects: {} };
  }
}
