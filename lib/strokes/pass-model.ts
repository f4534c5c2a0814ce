// The editor's in-memory pass: strokes and rooms by id, changed by the same
// operations the server applies, and by the server's deltas. Pure, so the
// editor and the tests share it. Every function reports the panels it touched,
// so the editor re-rasters only those.
import type { Lightbox, Op, Room, Stroke } from './types';
import { translatePoints } from './types';

export type PassDoc = {
  strokes: Map<string, Stroke>;
  rooms: Map<string, Room>;
  /** Ids removed here: a later add of the same id is ignored (the removal wins). */
  gone: Set<string>;
  goneRooms: Set<string>;
  lightboxes: Map<string, Lightbox>;
  goneLightboxes: Set<string>;
};

export type Delta = {
  strokes: Stroke[];
  removedStrokes: string[];
  rooms: Room[];
  removedRooms: string[];
  lightboxes?: Lightbox[];
  removedLightboxes?: string[];
};

export function emptyDoc(): PassDoc {
  return { strokes: new Map(), rooms: new Map(), gone: new Set(), goneRooms: new Set(), lightboxes: new Map(), goneLightboxes: new Set() };
}

export function docFrom(strokes: Stroke[], rooms: Room[], lightboxes: Lightbox[] = []): PassDoc {
  const doc = emptyDoc();
  for (const s of strokes) doc.strokes.set(s.id, s);
  for (const r of rooms) doc.rooms.set(r.id, r);
  for (const l of lightboxes) doc.lightboxes.set(l.id, l);
  return doc;
}

/** Applies one operation; returns the panels whose strokes changed. */
export function applyOp(doc: PassDoc, op: Op, touched = new Set<number>()): Set<number> {
  switch (op.op) {
    case 'add':
      if (doc.strokes.has(op.stroke.id) || doc.gone.has(op.stroke.id)) break;
      doc.strokes.set(op.stroke.id, op.stroke);
      touched.add(op.stroke.panel);
      break;
    case 'remove': {
      const s = doc.strokes.get(op.strokeId);
      doc.gone.add(op.strokeId);
      if (s) {
        doc.strokes.delete(op.strokeId);
        touched.add(s.panel);
      }
      break;
    }
    case 'move':
      for (const id of op.strokeIds) {
        const s = doc.strokes.get(id);
        if (!s) continue;
        doc.strokes.set(id, { ...s, points: translatePoints(s.points, op.dx, op.dy) });
        touched.add(s.panel);
      }
      break;
    case 'room':
      if (!doc.goneRooms.has(op.room.id)) doc.rooms.set(op.room.id, op.room);
      break;
    case 'unroom':
      doc.goneRooms.add(op.roomId);
      doc.rooms.delete(op.roomId);
      break;
    case 'lightbox':
      if (!doc.goneLightboxes.has(op.lightbox.id)) doc.lightboxes.set(op.lightbox.id, op.lightbox);
      break;
    case 'unlightbox':
      doc.goneLightboxes.add(op.lightboxId);
      doc.lightboxes.delete(op.lightboxId);
      break;
  }
  return touched;
}

/** Ids an operation acts on, to re-apply local work on top of what the server sent. */
export function idsOf(op: Op): string[] {
  switch (op.op) {
    case 'add':
      return [op.stroke.id];
    case 'remove':
      return [op.strokeId];
    case 'move':
      return op.strokeIds;
    case 'room':
      return [`room:${op.room.id}`];
    case 'unroom':
      return [`room:${op.roomId}`];
    case 'lightbox':
      return [`lightbox:${op.lightbox.id}`];
    case 'unlightbox':
      return [`lightbox:${op.lightboxId}`];
  }
}

/**
 * Takes the server's word for every id in the delta, then re-applies the local
 * operations the server has not seen yet on those ids only (operations on other
 * ids commute and are already applied).
 */
export function applyDelta(doc: PassDoc, delta: Delta, unseenLocal: Op[], touched = new Set<number>()): Set<number> {
  const ids = new Set<string>();
  for (const id of delta.removedStrokes) {
    const s = doc.strokes.get(id);
    if (s) touched.add(s.panel);
    doc.strokes.delete(id);
    ids.add(id);
  }
  for (const s of delta.strokes) {
    const old = doc.strokes.get(s.id);
    if (old && sameLook(old, s)) {
      // Our own stroke coming back from the server (quantised): nothing to redraw.
      doc.strokes.set(s.id, s);
      ids.add(s.id);
      continue;
    }
    if (old) touched.add(old.panel);
    doc.strokes.set(s.id, s);
    doc.gone.delete(s.id); // the server re-added it (a restore)
    touched.add(s.panel);
    ids.add(s.id);
  }
  for (const id of delta.removedRooms) {
    doc.rooms.delete(id);
    ids.add(`room:${id}`);
  }
  for (const r of delta.rooms) {
    doc.rooms.set(r.id, r);
    doc.goneRooms.delete(r.id);
    ids.add(`room:${r.id}`);
  }
  for (const id of delta.removedLightboxes ?? []) {
    doc.lightboxes.delete(id);
    ids.add(`lightbox:${id}`);
  }
  for (const l of delta.lightboxes ?? []) {
    doc.lightboxes.set(l.id, l);
    doc.goneLightboxes.delete(l.id);
    ids.add(`lightbox:${l.id}`);
  }
  for (const op of unseenLocal) {
    if (!idsOf(op).some((id) => ids.has(id))) continue;
    if (op.op === 'move') {
      // Only the strokes the server just replaced need the move again.
      const again = op.strokeIds.filter((id) => ids.has(id));
      applyOp(doc, { ...op, strokeIds: again }, touched);
    } else if (op.op === 'add') {
      // Our own pending add: the server has not stored it yet, so keep showing it.
      if (!doc.strokes.has(op.stroke.id) && !delta.removedStrokes.includes(op.stroke.id)) applyOp(doc, op, touched);
    } else {
      applyOp(doc, op, touched);
    }
  }
  return touched;
}

/** Same panel, pen and points to within the storage quantum: drawing it again would change nothing. */
export function sameLook(a: Stroke, b: Stroke, tolMm = 0.011): boolean {
  if (a.panel !== b.panel || a.tool !== b.tool || a.grey !== b.grey || a.size !== b.size) return false;
  if (a.points.length !== b.points.length) return false;
  for (let i = 0; i < a.points.length; i++) {
    const p = a.points[i]!;
    const q = b.points[i]!;
    if (Math.abs(p[0] - q[0]) > tolMm || Math.abs(p[1] - q[1]) > tolMm) return false;
  }
  return true;
}

/** Strokes of one panel, in drawing order. */
export function strokesOfPanel(doc: PassDoc, panel: number): Stroke[] {
  const out: Stroke[] = [];
  for (const s of doc.strokes.values()) if (s.panel === panel) out.push(s);
  return out;
}
