'use client';
// What the person has chosen on the canvas — strokes (lasso), a balloon room —
// and what they can do with it: delete, copy to another panel, move or resize a
// room. Strokes that leave the pass (someone else's eraser, a restore) leave the
// selection too.
import type Konva from 'konva';
import { nanoid } from 'nanoid';
import { useCallback, useEffect, useState } from 'react';
import type { Rect } from '@/lib/print/geometry';
import type { Point, Room, Stroke } from '@/lib/strokes/types';
import type { PassSession } from './use-pass-session';
import { addedStrokes, removedStrokes, roomChanged, roomRemoved } from './undo';

const r2 = (n: number) => Math.round(n * 100) / 100;

/** A room's box from its Konva node after a drag or a resize, kept inside its panel and at least 2 mm. */
export function roomFromNode(before: Room, node: { x: number; y: number; w: number; h: number; sx: number; sy: number }, panel: Rect): Room {
  let w = node.w * node.sx;
  let h = node.h * node.sy;
  // An ellipse is positioned by its centre, a box by its corner.
  let x = before.shape === 'ellipse' ? node.x - w / 2 : node.x;
  let y = before.shape === 'ellipse' ? node.y - h / 2 : node.y;
  x = Math.max(panel.x, Math.min(x, panel.x + panel.w - 2));
  y = Math.max(panel.y, Math.min(y, panel.y + panel.h - 2));
  w = Math.max(2, Math.min(w, panel.x + panel.w - x));
  h = Math.max(2, Math.min(h, panel.y + panel.h - y));
  return { ...before, x: r2(x), y: r2(y), w: r2(w), h: r2(h) };
}

/** Copies of strokes moved from their panels to `target`, under new ids. */
export function copiesInPanel(strokes: Stroke[], panels: Rect[], target: number, newId: () => string = nanoid): Stroke[] {
  const to = panels[target]!;
  return strokes.map((s) => {
    const from = panels[s.panel]!;
    const dx = to.x - from.x;
    const dy = to.y - from.y;
    return { ...s, id: newId(), panel: target, points: s.points.map(([x, y, p]) => [r2(x + dx), r2(y + dy), p] as Point) };
  });
}

export function useSelection(o: { session: PassSession; panels: Rect[] }) {
  const { session, panels } = o;
  const { commit, syncRef, setRooms } = session;
  const [ids, setIds] = useState<string[]>([]);
  const [room, setRoom] = useState<string | null>(null);

  useEffect(() => {
    // The session's effect, declared earlier, has made the sync by now.
    const sync = syncRef.current;
    if (!sync) return;
    const off = sync.onDoc(() => setIds((sel) => (sel.some((id) => !sync.doc.strokes.has(id)) ? sel.filter((id) => sync.doc.strokes.has(id)) : sel)));
    return () => {
      off();
    };
  }, [syncRef]);

  const strokes = useCallback((): Stroke[] => {
    const doc = syncRef.current?.doc;
    return doc ? ids.map((id) => doc.strokes.get(id)).filter((s): s is Stroke => !!s) : [];
  }, [ids, syncRef]);

  const deleteStrokes = () => {
    const chosen = strokes();
    if (chosen.length)
      commit(
        chosen.map((s) => ({ op: 'remove', strokeId: s.id })),
        removedStrokes(chosen),
      );
    setIds([]);
  };

  const deleteRoom = () => {
    const r = room ? syncRef.current?.doc.rooms.get(room) : undefined;
    if (r) commit([{ op: 'unroom', roomId: r.id }], roomRemoved(r));
    setRoom(null);
  };

  const copyTo = (target: number) => {
    const chosen = strokes();
    if (!chosen.length) return;
    const copies = copiesInPanel(chosen, panels, target);
    commit(
      copies.map((stroke) => ({ op: 'add', stroke })),
      addedStrokes(copies),
    );
    setIds(copies.map((c) => c.id));
  };

  const roomEdited = (id: string, node: Konva.Shape) => {
    const sync = syncRef.current;
    const before = sync?.doc.rooms.get(id);
    if (!sync || !before) return;
    const sx = node.scaleX();
    const sy = node.scaleY();
    node.scale({ x: 1, y: 1 });
    const size =
      before.shape === 'ellipse'
        ? { w: (node as Konva.Ellipse).radiusX() * 2, h: (node as Konva.Ellipse).radiusY() * 2 }
        : { w: node.width(), h: node.height() };
    const after = roomFromNode(before, { x: node.x(), y: node.y(), ...size, sx, sy }, panels[before.panel]!);
    commit([{ op: 'room', room: after }], roomChanged(before, after));
    setRooms([...sync.doc.rooms.values()]);
  };

  const clear = () => {
    setIds([]);
    setRoom(null);
  };

  return { ids, setIds, strokes, room, setRoom, deleteStrokes, deleteRoom, copyTo, roomEdited, clear };
}

export type Selection = ReturnType<typeof useSelection>;
