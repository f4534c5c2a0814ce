'use client';
// The thin listener around the pure gestures (gestures.ts): pointer events on the
// canvas become page coordinates, go through the state machine, and its effects
// are handed to `apply`. Listeners are attached once; the latest tool, settings
// and callbacks are read through effect events, so changing a tool or a width
// re-attaches nothing. Two fingers pinch and pan the view; the wheel zooms.
import type Konva from 'konva';
import { type RefObject, useEffect, useEffectEvent, useRef } from 'react';
import { type View, toPage, zoomAt } from '@/lib/print/view';
import { type Effects, type Gesture, type Scene, type Settings, pointerDown, pointerMove, pointerUp } from './gestures';

type Opts = {
  wrapRef: RefObject<HTMLDivElement | null>;
  stageRef: RefObject<Konva.Stage | null>;
  view: () => View;
  setView: (f: (v: View) => View) => void;
  settings: Settings;
  scene: () => Scene;
  apply: (effects: Effects) => void;
  /** The overlay (live stroke, lasso, eraser ring) needs drawing again. */
  redraw: () => void;
};

export function usePointerGestures(o: Opts) {
  /** The gesture in progress, for the overlay to draw. */
  const gestureRef = useRef<Gesture | null>(null);
  /** The pointer's page position, for the eraser ring. */
  const cursorRef = useRef<{ x: number; y: number } | null>(null);
  const touches = useRef(new Map<number, { x: number; y: number }>());
  const pinch = useRef<{ dist: number; mid: { x: number; y: number } } | null>(null);

  const local = (e: PointerEvent | WheelEvent) => {
    const rect = o.wrapRef.current!.getBoundingClientRect();
    return { x: e.clientX - rect.left, y: e.clientY - rect.top };
  };

  const input = (e: PointerEvent, over: 'room' | 'lightbox' | null = null) => {
    const pt = local(e);
    const mm = toPage(o.view(), pt.x, pt.y);
    return { pointerId: e.pointerId, pointerType: e.pointerType, button: e.button, x: mm.x, y: mm.y, sx: pt.x, sy: pt.y, pressure: e.pressure, over };
  };

  const onDown = useEffectEvent((e: PointerEvent) => {
    const pt = local(e);
    if (e.pointerType === 'touch') {
      touches.current.set(e.pointerId, pt);
      if (touches.current.size === 2) {
        // Two fingers: pinch and pan; drop whatever one finger started.
        gestureRef.current = null;
        const [a, b] = [...touches.current.values()];
        pinch.current = { dist: Math.hypot(a!.x - b!.x, a!.y - b!.y), mid: { x: (a!.x + b!.x) / 2, y: (a!.y + b!.y) / 2 } };
        o.redraw();
        return;
      }
    }
    // Rooms and lightboxes are Konva shapes with their own drag and resize handles.
    const hit = o.stageRef.current?.getIntersection(pt);
    const handles = hit?.getParent()?.className === 'Transformer';
    const over =
      hit && (hit.name() === 'room' || (handles && o.settings.tool === 'room'))
        ? 'room'
        : hit && (hit.name() === 'lightbox' || (handles && o.settings.tool === 'lightbox'))
          ? 'lightbox'
          : null;
    const step = pointerDown(o.settings, o.scene(), input(e, over));
    gestureRef.current = step.gesture;
    if (step.effects.capture) o.wrapRef.current?.setPointerCapture(e.pointerId);
    o.apply(step.effects);
    o.redraw();
  });

  const onMove = useEffectEvent((e: PointerEvent) => {
    const pt = local(e);
    if (e.pointerType === 'touch' && touches.current.has(e.pointerId)) {
      touches.current.set(e.pointerId, pt);
      if (touches.current.size === 2 && pinch.current) {
        const [a, b] = [...touches.current.values()];
        const dist = Math.hypot(a!.x - b!.x, a!.y - b!.y);
        const mid = { x: (a!.x + b!.x) / 2, y: (a!.y + b!.y) / 2 };
        const prev = pinch.current;
        o.setView((v) => {
          const z = zoomAt(v, dist / Math.max(1, prev.dist), mid.x, mid.y);
          return { ...z, originX: z.originX + (mid.x - prev.mid.x), originY: z.originY + (mid.y - prev.mid.y) };
        });
        pinch.current = { dist, mid };
        return;
      }
    }
    const base = input(e);
    cursorRef.current = { x: base.x, y: base.y };
    const g = gestureRef.current;
    if (!g || g.pointerId !== e.pointerId) {
      if (o.settings.tool === 'eraser') o.redraw();
      return;
    }
    const coalesced = g.kind === 'draw' && typeof e.getCoalescedEvents === 'function' ? e.getCoalescedEvents() : [];
    const samples = coalesced.map((ce) => {
      const p = local(ce);
      const mm = toPage(o.view(), p.x, p.y);
      return { x: mm.x, y: mm.y, pressure: ce.pressure };
    });
    const step = pointerMove(g, o.scene(), { ...base, samples });
    gestureRef.current = step.gesture;
    o.apply(step.effects);
    o.redraw();
  });

  const onUp = useEffectEvent((e: PointerEvent) => {
    if (e.pointerType === 'touch') {
      touches.current.delete(e.pointerId);
      if (touches.current.size < 2) pinch.current = null;
    }
    const g = gestureRef.current;
    if (!g || g.pointerId !== e.pointerId) return;
    const step = pointerUp(g, o.settings, o.scene(), e);
    gestureRef.current = step.gesture;
    o.apply(step.effects);
    o.redraw();
  });

  const onWheel = useEffectEvent((e: WheelEvent) => {
    e.preventDefault();
    const pt = local(e);
    if (e.shiftKey || e.altKey) {
      o.setView((v) => ({ ...v, originX: v.originX - (e.shiftKey ? e.deltaY : e.deltaX), originY: v.originY - (e.shiftKey ? 0 : e.deltaY) }));
    } else {
      o.setView((v) => zoomAt(v, Math.exp(-e.deltaY * 0.0015), pt.x, pt.y));
    }
  });

  const onLeave = useEffectEvent(() => {
    cursorRef.current = null;
    o.redraw();
  });

  const { wrapRef } = o;
  useEffect(() => {
    const el = wrapRef.current;
    if (!el) return;
    const down = (e: PointerEvent) => onDown(e);
    const move = (e: PointerEvent) => onMove(e);
    const up = (e: PointerEvent) => onUp(e);
    const wheel = (e: WheelEvent) => onWheel(e);
    const leave = () => onLeave();
    el.addEventListener('pointerdown', down);
    el.addEventListener('pointermove', move);
    el.addEventListener('pointerup', up);
    el.addEventListener('pointercancel', up);
    el.addEventListener('pointerleave', leave);
    el.addEventListener('wheel', wheel, { passive: false });
    return () => {
      el.removeEventListener('pointerdown', down);
      el.removeEventListener('pointermove', move);
      el.removeEventListener('pointerup', up);
      el.removeEventListener('pointercancel', up);
      el.removeEventListener('pointerleave', leave);
      el.removeEventListener('wheel', wheel);
    };
  }, [wrapRef]);

  return { gestureRef, cursorRef };
}
