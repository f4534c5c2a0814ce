// Undo and redo of the person's own operations, sent as new operations.
// A removal is final for its id (a tombstone), so bringing a stroke or room
// back re-adds a copy under a fresh id; each entry remembers the current id.
import { nanoid } from 'nanoid';
import type { Op, Room, Stroke } from '@/lib/strokes/types';

export type UndoEntry = { undo: () => Op[]; redo: () => Op[] };

export function addedStrokes(strokes: Stroke[]): UndoEntry {
  let current = strokes;
  return {
    undo: () => current.map((s) => ({ op: 'remove', strokeId: s.id })),
    redo: () => {
      current = current.map((s) => ({ ...s, id: nanoid() }));
      return current.map((s) => ({ op: 'add', stroke: s }));
    },
  };
}

export function removedStrokes(strokes: Stroke[]): UndoEntry {
  const inverse = addedStrokes(strokes);
  return { undo: inverse.redo, redo: inverse.undo };
}

export function movedStrokes(ids: string[], dx: number, dy: number): UndoEntry {
  return {
    undo: () => [{ op: 'move', strokeIds: ids, dx: -dx, dy: -dy }],
    redo: () => [{ op: 'move', strokeIds: ids, dx, dy }],
  };
}

/** A room drawn (before = null) or changed (before = its previous shape). */
export function roomChanged(before: Room | null, after: Room): UndoEntry {
  let id = after.id;
  return {
    undo: () => (before ? [{ op: 'room', room: { ...before, id } }] : [{ op: 'unroom', roomId: id }]),
    redo: () => {
      if (!before) id = nanoid();
      return [{ op: 'room', room: { ...after, id } }];
    },
  };
}

export function roomRemoved(room: Room): UndoEntry {
  const inverse = roomChanged(null, room);
  return { undo: inverse.redo, redo: inverse.undo };
}

export class UndoStack {
  private done: UndoEntry[] = [];
  private undone: UndoEntry[] = [];
  push(e: UndoEntry) {
    this.done.push(e);
    if (this.done.length > 200) this.done.shift();
    this.undone = [];
  }
  undo(): Op[] | null {
    const e = this.done.pop();
    if (!e) return null;
    this.undone.push(e);
    return e.undo();
  }
  redo(): Op[] | null {
    const e = this.undone.pop();
    if (!e) return null;
    this.done.push(e);
    return e.redo();
  }
  get canUndo() {
    return this.done.length > 0;
  }
  get canRedo() {
    return this.undone.length > 0;
  }
}
