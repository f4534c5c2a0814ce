// The editor's pointer gestures without a canvas: tool × pointer events → operations.
import { describe, expect, it } from 'vitest';
import {
  type Gesture,
  type PointerInput,
  type Scene,
  type Settings,
  nearestPanel,
  pointerDown,
  pointerMove,
  pointerUp,
} from '@/components/editor/gestures';
import { DEFAULT_PAGE_SPEC, panelRects } from '@/lib/print/geometry';
import type { Stroke } from '@/lib/strokes/types';

const spec = DEFAULT_PAGE_SPEC; // 150 × 150 mm trim, 3 mm bleed, 5 mm safe, 4 mm gutter
const panels = panelRects(spec);

function scene(strokes: Stroke[] = [], selection: Stroke[] = []): Scene {
  let n = 0;
  return { spec, strokes: () => strokes, selection, eraserRadius: 2, newId: () => `id${++n}` };
}
const settings = (over: Partial<Settings> = {}): Settings => ({
  tool: 'pen',
  canDraw: true,
  penOnly: false,
  penSize: 0.5,
  toneSize: 5,
  toneGrey: 40,
  roomShape: 'ellipse',
  ...over,
});
const at = (x: number, y: number, over: Partial<PointerInput> = {}): PointerInput => ({
  pointerId: 1,
  pointerType: 'pen',
  button: 0,
  x,
  y,
  sx: x * 4,
  sy: y * 4,
  pressure: 0.7,
  ...over,
});

/** Runs down, moves and up through the machine; returns every effect in order and the last gesture. */
function drag(s: Settings, sc: Scene, points: [number, number][], over: Partial<PointerInput> = {}) {
  const effects = [];
  let step = pointerDown(s, sc, at(...points[0]!, over));
  effects.push(step.effects);
  for (const p of points.slice(1)) {
    step = pointerMove(step.gesture, sc, at(...p, over));
    effects.push(step.effects);
  }
  const last = step.gesture;
  step = pointerUp(step.gesture, s, sc, at(...points[points.length - 1]!, over));
  effects.push(step.effects);
  return { effects, last, end: step.effects };
}

const line = (id: string, x0: number, y0: number, x1: number, y1: number, panel = 0): Stroke => ({
  id,
  panel,
  tool: 'pen',
  grey: 100,
  size: 0.5,
  points: [
    [x0, y0, 0.5],
    [(x0 + x1) / 2, (y0 + y1) / 2, 0.5],
    [x1, y1, 0.5],
  ],
});

describe('pen and tone', () => {
  it('a pen drag in panel 2 adds one stroke there, with the pen width, drawn into its bitmap and undoable', () => {
    const p = panels[1]!;
    const { end } = drag(settings(), scene(), [
      [p.x + 5, p.y + 5],
      [p.x + 10, p.y + 8],
      [p.x + 20, p.y + 20],
    ]);
    expect(end.ops).toHaveLength(1);
    const op = end.ops![0]!;
    expect(op.op).toBe('add');
    if (op.op !== 'add') return;
    expect(op.stroke).toMatchObject({ panel: 1, tool: 'pen', grey: 100, size: 0.5 });
    expect(op.stroke.points[0]).toEqual([p.x + 5, p.y + 5, 0.7]);
    expect(end.drawn).toBe(op.stroke);
    expect(end.undo!.undo()).toEqual([{ op: 'remove', strokeId: op.stroke.id }]);
  });

  it('the tone marker takes its grey and width; a mouse has no pressure (0.5)', () => {
    const { end } = drag(
      settings({ tool: 'tone' }),
      scene(),
      [
        [20, 20],
        [30, 30],
      ],
      { pointerType: 'mouse', pressure: 0 },
    );
    const op = end.ops![0]!;
    if (op.op !== 'add') throw new Error('expected an add');
    expect(op.stroke).toMatchObject({ tool: 'tone', grey: 40, size: 5 });
    expect(op.stroke.points.every((pt) => pt[2] === 0.5)).toBe(true);
  });

  it('points are kept inside the bleed box; a start in the gutter goes to the nearest panel', () => {
    const gutterX = panels[0]!.x + panels[0]!.w + 1; // 1 mm into the gutter, nearer panel 1 (left)
    expect(nearestPanel(spec, gutterX, 20)).toBe(0);
    const { end } = drag(settings(), scene(), [
      [gutterX, 20],
      [400, -50],
    ]);
    const op = end.ops![0]!;
    if (op.op !== 'add') throw new Error('expected an add');
    expect(op.stroke.panel).toBe(0);
    const last = op.stroke.points[op.stroke.points.length - 1]!;
    expect(last[0]).toBe(spec.trimW + spec.bleed);
    expect(last[1]).toBe(-spec.bleed);
  });

  it('coalesced samples all land in the stroke', () => {
    let step = pointerDown(settings(), scene(), at(20, 20));
    step = pointerMove(step.gesture, scene(), {
      ...at(23, 23),
      samples: [
        { x: 21, y: 21, pressure: 0.2 },
        { x: 22, y: 22, pressure: 0.3 },
        { x: 23, y: 23, pressure: 0.4 },
      ],
    });
    expect((step.gesture as Extract<Gesture, { kind: 'draw' }>).points.map((p) => p[2])).toEqual([0.7, 0.2, 0.3, 0.4]);
  });

  it('pen-only mode: a touch draws nothing, a pen does', () => {
    const s = settings({ penOnly: true });
    expect(pointerDown(s, scene(), at(20, 20, { pointerType: 'touch' })).gesture).toBeNull();
    expect(pointerDown(s, scene(), at(20, 20, { pointerType: 'pen' })).gesture?.kind).toBe('draw');
  });

  it('another pointer moving or lifting does not touch the stroke', () => {
    const step = pointerDown(settings(), scene(), at(20, 20));
    expect(pointerMove(step.gesture, scene(), at(30, 30, { pointerId: 2 })).gesture).toBe(step.gesture);
    expect(pointerUp(step.gesture, settings(), scene(), { pointerId: 2 }).effects).toEqual({});
  });

  it('a viewer (cannot draw) pans instead, by the screen distance moved', () => {
    const { effects } = drag(settings({ canDraw: false }), scene(), [
      [20, 20],
      [25, 22],
    ]);
    expect(effects[1]!.panBy).toEqual({ dx: 20, dy: 8 });
    expect(effects.some((e) => e.ops)).toBe(false);
  });
});

describe('eraser', () => {
  it('removes every stroke it touches, once, and undo brings them back', () => {
    const a = line('a', 20, 20, 40, 20);
    const b = line('b', 20, 30, 40, 30);
    const far = line('far', 20, 60, 40, 60);
    const { effects, end } = drag(settings({ tool: 'eraser' }), scene([a, b, far]), [
      [30, 19],
      [30, 25],
      [30, 31],
      [30, 31],
    ]);
    const removed = effects.flatMap((e) => e.ops ?? []);
    expect(removed).toEqual([
      { op: 'remove', strokeId: 'a' },
      { op: 'remove', strokeId: 'b' },
    ]);
    const back = end.undo!.undo();
    expect(back.map((o) => o.op)).toEqual(['add', 'add']);
  });
});

describe('cutting eraser', () => {
  it('cuts a stroke where it passes (remove it, add its pieces); a second pass cuts a piece; undo puts the stroke back whole', () => {
    // A long line along y = 20 and the eraser crossing it twice, at x = 30 and x = 50.
    const long: Stroke = { ...line('long', 10, 20, 70, 20), points: [10, 20, 30, 40, 50, 60, 70].map((x) => [x, 20, 0.5]) };
    const live = new Map<string, Stroke>([[long.id, long]]);
    const sc: Scene = { ...scene(), strokes: () => live.values() };
    const s = settings({ tool: 'eraser', eraserCuts: true });
    const commit = (ops: { op: string; strokeId?: string; stroke?: Stroke }[] = []) => {
      for (const op of ops) {
        if (op.op === 'remove') live.delete(op.strokeId!);
        if (op.op === 'add') live.set(op.stroke!.id, op.stroke!);
      }
    };
    let step = pointerDown(s, sc, at(30, 15));
    commit(step.effects.ops);
    for (const [x, y] of [
      [30, 25],
      [40, 25],
      [50, 25],
      [50, 15],
    ] as [number, number][]) {
      step = pointerMove(step.gesture, sc, at(x, y));
      commit(step.effects.ops);
    }
    const end = pointerUp(step.gesture, s, sc, at(50, 15)).effects;
    // Three pieces are left: left of x≈30, between the cuts, right of x≈50; none reaches into a cut.
    const pieces = [...live.values()];
    expect(pieces).toHaveLength(3);
    expect(live.has('long')).toBe(false);
    const xs = pieces.map((p) => p.points.map(([x]) => x)).sort((a, b) => a[0]! - b[0]!);
    expect(Math.max(...xs[0]!)).toBeLessThan(30 - 2);
    expect(Math.min(...xs[1]!)).toBeGreaterThan(30 + 2);
    expect(Math.max(...xs[1]!)).toBeLessThan(50 - 2);
    expect(Math.min(...xs[2]!)).toBeGreaterThan(50 + 2);
    for (const p of pieces)
      expect({ tool: p.tool, size: p.size, grey: p.grey, panel: p.panel }).toEqual({ tool: 'pen', size: 0.5, grey: 100, panel: 0 });

    const back = end.undo!.undo();
    commit(back);
    expect([...live.values()]).toHaveLength(1);
    expect([...live.values()][0]!.points).toEqual(long.points);
    expect([...live.values()][0]!.id).not.toBe('long'); // a removed id never comes back
    commit(end.undo!.redo());
    expect([...live.values()]).toHaveLength(3);
  });
});

describe('lasso', () => {
  it('selects the strokes inside the loop', () => {
    const inside = line('in', 22, 22, 28, 28);
    const outside = line('out', 50, 50, 60, 60);
    const { effects, end } = drag(settings({ tool: 'lasso' }), scene([inside, outside]), [
      [15, 15],
      [35, 15],
      [35, 35],
      [15, 35],
    ]);
    expect(effects[0]!.select).toEqual([]);
    expect(end.select).toEqual(['in']);
  });

  it('dragging inside the selection moves it, clamped to the bleed box, as one undoable move', () => {
    const s = line('s', 20, 20, 30, 20);
    const { end } = drag(settings({ tool: 'lasso' }), scene([s], [s]), [
      [25, 20],
      [25, 10],
      [25, -100],
    ]);
    const dyMax = -spec.bleed - (20 - 0.25); // up to the bleed edge, less half the width
    expect(end.ops).toEqual([{ op: 'move', strokeIds: ['s'], dx: 0, dy: Math.round(dyMax * 100) / 100 }]);
    expect(end.undo!.undo()).toEqual([{ op: 'move', strokeIds: ['s'], dx: -0, dy: -Math.round(dyMax * 100) / 100 }]);
  });
});

describe('balloon rooms, pins, lightbox', () => {
  it('a room is drawn inside its panel with the chosen shape; a tiny one is dropped', () => {
    const p = panels[2]!;
    const { end } = drag(settings({ tool: 'room', roomShape: 'rect' }), scene(), [
      [p.x + 2, p.y + 2],
      [p.x + 30, p.y + 20],
    ]);
    expect(end.ops).toEqual([{ op: 'room', room: { id: 'id1', panel: 2, shape: 'rect', x: p.x + 2, y: p.y + 2, w: 28, h: 18 } }]);
    expect(end.selectRoom).toBe('id1');
    expect(
      drag(settings({ tool: 'room' }), scene(), [
        [p.x + 2, p.y + 2],
        [p.x + 3, p.y + 3],
      ]).end,
    ).toEqual({});
  });

  it('pressing on an existing room or lightbox leaves it to its handles', () => {
    expect(pointerDown(settings({ tool: 'room' }), scene(), at(20, 20, { over: 'room' }))).toEqual({ gesture: null, effects: {} });
    expect(pointerDown(settings({ tool: 'lightbox' }), scene(), at(20, 20, { over: 'lightbox' }))).toEqual({ gesture: null, effects: {} });
    expect(pointerDown(settings({ tool: 'lightbox' }), scene(), at(20, 20)).effects).toEqual({ clearLightbox: true });
  });

  it('the pin tool places a point pin in the nearest panel, to 0.1 mm', () => {
    const p = panels[3]!;
    expect(pointerDown(settings({ tool: 'pin' }), scene(), at(p.x + 10.04, p.y + 3.06)).effects.pin).toEqual({
      panel: 3,
      x: Math.round((p.x + 10.04) * 10) / 10,
      y: Math.round((p.y + 3.06) * 10) / 10,
    });
  });
});
