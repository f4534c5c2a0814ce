// Undo and redo of the person's own operations, sent as new operations.
// A removal is final for its id (a tombstone), so bringing a stroke or room
// back re-adds a copy under a fresh id; each entry remembers the current id.
import { nanoid } from 'nanoid';
import type { Lightbox, Op, Room, Stroke } from '@/lib/strokes/types';

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

/**
 * A cut by the eraser: undo takes the pieces away and puts the cut strokes back; redo cuts again.
 * Each way adds under fresh ids (a removed id never comes back: the pass log's rule).
 */
export function cutStrokes(cut: Stroke[], pieces: Stroke[]): UndoEntry {
  let whole = cut;
  let left = pieces;
  const again = (list: Stroke[]) => list.map((s) => ({ ...s, id: nanoid() }));
  return {
    undo: () => {
      const ops: Op[] = left.map((s) => ({ op: 'remove', strokeId: s.id }));
      whole = again(whole);
      return [...ops, ...whole.map((s): Op => ({ op: 'add', stroke: s }))];
    },
    redo: () => {
      const ops: Op[] = whole.map((s) => ({ op: 'remove', strokeId: s.id }));
      left = again(left);
      return [...ops, ...left.map((s): Op => ({ op: 'add', stroke: s }))];
    },
  };
}

export function movedStrokes(ids: string[], dx: number, dy: number): UndoEntry {
  return {
    undo: () => [{ op: 'move', strokeIds: ids, dx: -dx, dy: -dy }],
    redo: () => [{ op: 'move', strokeIds: ids, dx, dy }],
  };
}

/** An item placed (before = null) or changed (before = its previous value); a removal is final for its id. */
function itemChanged<T extends { id: string }>(before: T | null, after: T, put: (item: T) => Op, take: (id: string) => Op): UndoEntry {
  let id = after.id;
  return {
    undo: () => [before ? put({ ...before, id }) : take(id)],
    redo: () => {
      if (!before) id = nanoid();
      return [put({ ...after, id })];
    },
  };
}

function inverse(e: UndoEntry): UndoEntry {
  return { undo: e.redo, redo: e.undo };
}

const putRoom = (room: Room): Op => ({ op: 'room', room });
const takeRoom = (roomId: string): Op => ({ op: 'unroom', roomId });
const putLightbox = (lightbox: Lightbox): Op => ({ op: 'lightbox', lightbox });
const takeLightbox = (lightboxId: string): Op => ({ op: 'unlightbox', lightboxId });

export const roomChanged = (before: Room | null, after: Room) => itemChanged(before, after, putRoom, takeRoom);
export const roomRemoved = (room: Room) => inverse(roomChanged(null, room));
export const lightboxChanged = (before: Lightbox | null, after: Lightbox) => itemChanged(before, after, putLightbox, takeLightbox);
export const lightboxRemoved = (l: Lightbox) => inverse(lightboxChanged(null, l));

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
