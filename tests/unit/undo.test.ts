import { describe, expect, it } from 'vitest';
import { UndoStack, addedStrokes, movedStrokes, roomChanged } from '@/components/editor/undo';
import { applyOp, emptyDoc } from '@/lib/strokes/pass-model';
import type { Op, Stroke } from '@/lib/strokes/types';

const s: Stroke = { id: 'a', panel: 0, tool: 'pen', grey: 100, size: 1, points: [[10, 10, 0.5]] };

describe('undo and redo', () => {
  it('undo of a stroke removes it; redo brings back a copy under a new id that undo can remove again', () => {
    const doc = emptyDoc();
    const stack = new UndoStack();
    const run = (ops: Op[] | null) => ops?.forEach((o) => applyOp(doc, o));
    run([{ op: 'add', stroke: s }]);
    stack.push(addedStrokes([s]));
    run(stack.undo());
    expect(doc.strokes.size).toBe(0);
    run(stack.redo());
    expect(doc.strokes.size).toBe(1);
    const [copy] = [...doc.strokes.values()];
    expect(copy!.id).not.toBe('a');
    expect(copy!.points).toEqual(s.points);
    run(stack.undo());
    expect(doc.strokes.size).toBe(0);
  });

  it('undo of a move moves back', () => {
    const e = movedStrokes(['a'], 3, -1);
    expect(e.undo()).toEqual([{ op: 'move', strokeIds: ['a'], dx: -3, dy: 1 }]);
  });

  it('undo of a new room removes it; of a change, restores the old shape', () => {
    const r = { id: 'r', panel: 1, shape: 'rect' as const, x: 80, y: 8, w: 20, h: 10 };
    expect(roomChanged(null, r).undo()).toEqual([{ op: 'unroom', roomId: 'r' }]);
    expect(roomChanged(r, { ...r, w: 30 }).undo()).toEqual([{ op: 'room', room: r }]);
  });

  it('a new action clears redo', () => {
    const stack = new UndoStack();
    stack.push(movedStrokes(['a'], 1, 1));
    stack.undo();
    expect(stack.canRedo).toBe(true);
    stack.push(movedStrokes(['a'], 2, 2));
    expect(stack.canRedo).toBe(false);
  });
});
