import { describe, expect, it } from 'vitest';
import { Outbox } from '@/lib/strokes/outbox';
import { applyDelta, applyOp, docFrom, emptyDoc } from '@/lib/strokes/pass-model';
import type { Op, Stroke } from '@/lib/strokes/types';

const s = (id: string, panel = 0, x = 10): Stroke => ({
  id,
  panel,
  tool: 'pen',
  grey: 100,
  size: 1,
  points: [
    [x, 10, 0.5],
    [x + 5, 12, 0.5],
  ],
});

describe('pass model', () => {
  it('operations on different ids commute', () => {
    const ops: Op[] = [
      { op: 'add', stroke: s('a') },
      { op: 'add', stroke: s('b', 1, 80) },
      { op: 'move', strokeIds: ['a'], dx: 2, dy: 0 },
      { op: 'remove', strokeId: 'b' },
    ];
    const one = emptyDoc();
    ops.forEach((o) => applyOp(one, o));
    const two = emptyDoc();
    [ops[1]!, ops[3]!, ops[0]!, ops[2]!].forEach((o) => applyOp(two, o));
    expect([...one.strokes.values()]).toEqual([...two.strokes.values()]);
    expect(one.strokes.get('a')!.points[0]![0]).toBe(12);
  });

  it('a removal beats an add of the same id', () => {
    const doc = emptyDoc();
    applyOp(doc, { op: 'remove', strokeId: 'x' });
    applyOp(doc, { op: 'add', stroke: s('x') });
    expect(doc.strokes.size).toBe(0);
  });

  it('reports the panels touched', () => {
    const doc = docFrom([s('a', 2), s('b', 3)], []);
    expect([...applyOp(doc, { op: 'move', strokeIds: ['a', 'b'], dx: 1, dy: 1 })].sort()).toEqual([2, 3]);
  });

  it('a delta replaces by id and keeps local moves the server has not seen', () => {
    const doc = docFrom([s('a'), s('b')], []);
    const localMove: Op = { op: 'move', strokeIds: ['a', 'b'], dx: 5, dy: 0 };
    applyOp(doc, localMove);
    const localAdd: Op = { op: 'add', stroke: s('mine', 1, 90) };
    applyOp(doc, localAdd);
    // Someone else removed b; the server also re-sends a (say its grey changed by a restore).
    applyDelta(doc, { strokes: [{ ...s('a'), grey: 40 }], removedStrokes: ['b'], rooms: [], removedRooms: [] }, [localMove, localAdd]);
    expect(doc.strokes.get('a')).toMatchObject({
      grey: 40,
      points: [
        [15, 10, 0.5],
        [20, 12, 0.5],
      ],
    });
    expect(doc.strokes.has('b')).toBe(false);
    expect(doc.strokes.has('mine')).toBe(true);
  });
});

class MemoryStore {
  data = new Map<string, string>();
  getItem(k: string) {
    return this.data.get(k) ?? null;
  }
  setItem(k: string, v: string) {
    this.data.set(k, v);
  }
  removeItem(k: string) {
    this.data.delete(k);
  }
}

describe('outbox', () => {
  it('keeps operations across a reload until acknowledged, under the same batch id', () => {
    const store = new MemoryStore();
    let n = 0;
    const box = new Outbox(store, 'k', () => `b${++n}`);
    box.push({ op: 'add', stroke: s('a') });
    box.push({ op: 'add', stroke: s('b') });
    expect(box.waiting).toBe(2);
    // Reload before sealing: the open operations are still there.
    const again = new Outbox(store, 'k', () => `c${++n}`);
    expect(again.pendingOps().map((o) => (o.op === 'add' ? o.stroke.id : ''))).toEqual(['a', 'b']);
    again.seal();
    const batch = again.next()!;
    // Reload after sealing: the same batch id comes back, so a retry is recognised.
    const third = new Outbox(store, 'k', () => 'never');
    expect(third.next()).toEqual(batch);
    third.ack(batch.batchId);
    expect(third.waiting).toBe(0);
    expect(store.data.has('k')).toBe(false);
  });

  it('sends batches oldest first', () => {
    const box = new Outbox(
      new MemoryStore(),
      'k',
      (() => {
        let i = 0;
        return () => `b${++i}`;
      })(),
    );
    box.push({ op: 'remove', strokeId: 'x' });
    box.seal();
    box.push({ op: 'remove', strokeId: 'y' });
    box.seal();
    expect(box.next()!.batchId).toBe('b1');
    box.ack('b1');
    expect(box.next()!.batchId).toBe('b2');
  });

  it('sets a damaged entry aside instead of crashing', () => {
    const store = new MemoryStore();
    store.setItem('k', '{not json');
    const box = new Outbox(store, 'k', () => 'x');
    expect(box.waiting).toBe(0);
    expect([...store.data.keys()].some((k) => k.startsWith('k:damaged:'))).toBe(true);
  });
});
