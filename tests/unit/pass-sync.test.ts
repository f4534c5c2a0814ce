// @vitest-environment jsdom
// The editor's sync when the server refuses a batch: the valid operations still land,
// and a drawn stroke is never thrown away (issue 13: "no stroke dropped by a refused batch").
import { afterEach, describe, expect, it, vi } from 'vitest';
import { PassSync } from '@/components/editor/pass-sync';
import type { Lightbox, Op, Stroke } from '@/lib/strokes/types';

function memoryStorage(): Storage {
  const m = new Map<string, string>();
  return {
    getItem: (k) => m.get(k) ?? null,
    setItem: (k, v) => void m.set(k, v),
    removeItem: (k) => void m.delete(k),
    clear: () => m.clear(),
    key: (i) => [...m.keys()][i] ?? null,
    get length() {
      return m.size;
    },
  };
}

const stroke = (id: string): Stroke => ({
  id,
  panel: 0,
  tool: 'pen',
  grey: 100,
  size: 0.5,
  points: [
    [10, 10, 0.5],
    [20, 20, 0.5],
  ],
});
const staleLightbox: Lightbox = { id: 'lb', uploadId: 'gone', panel: null, x: 0, y: 0, w: 50, h: 50, rotation: 0, opacity: 0.5, visible: true };

/** A server that refuses any batch holding `refuse(op)`, and stores the rest. */
function fakeServer(refuse: (op: Op) => string | null) {
  const stored: Stroke[] = [];
  let seq = 0;
  vi.stubGlobal('fetch', async (url: string, init?: RequestInit) => {
    if (init?.method === 'POST') {
      const batch = JSON.parse(String(init.body)) as { ops: Op[] };
      const why = batch.ops.map(refuse).find(Boolean);
      if (why) return new Response(JSON.stringify({ error: why }), { status: 422, headers: { 'content-type': 'application/json' } });
      for (const op of batch.ops) if (op.op === 'add') stored.push(op.stroke);
      return Response.json({ seq: ++seq });
    }
    return Response.json({
      id: 'p',
      seq,
      since: 0,
      strokes: stored,
      rooms: [],
      lightboxes: [],
      removedStrokes: [],
      removedRooms: [],
      removedLightboxes: [],
    });
  });
  return { stored };
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('PassSync after a refusal', () => {
  it('a stroke sent with a stale lightbox change still lands: the refused batch is split and retried op by op', async () => {
    const server = fakeServer((op) => (op.op === 'lightbox' ? 'There is no upload gone in this series.' : null));
    const sync = new PassSync('p', { seq: 0, strokes: [], rooms: [], lightboxes: [] }, memoryStorage());
    sync.start();
    sync.commit([
      { op: 'add', stroke: stroke('drawn') },
      { op: 'lightbox', lightbox: staleLightbox },
    ]);
    sync.flush();
    await vi.waitFor(() => expect(server.stored.map((s) => s.id)).toEqual(['drawn']));
    await vi.waitFor(() => expect(sync.doc.strokes.has('drawn')).toBe(true));
    sync.stop();
  });

  it('a stroke refused on its own is kept on this device and on screen, and the problem is said', async () => {
    const storage = memoryStorage();
    fakeServer((op) => (op.op === 'add' && op.stroke.id === 'odd' ? 'A stroke may have at most 10,000 points.' : null));
    const sync = new PassSync('p', { seq: 0, strokes: [], rooms: [], lightboxes: [] }, storage);
    const messages: (string | null)[] = [];
    sync.onStatus((s) => messages.push(s.message));
    sync.start();
    sync.commit([{ op: 'add', stroke: stroke('odd') }]);
    sync.flush();
    await vi.waitFor(() => expect(messages.some((m) => /kept on this device/.test(m ?? ''))).toBe(true));
    expect(sync.doc.strokes.has('odd')).toBe(true);
    // Still there after the pass is read again from the server, and after a reload.
    await sync.resync();
    expect(sync.doc.strokes.has('odd')).toBe(true);
    sync.stop();
    const reloaded = new PassSync('p', { seq: 0, strokes: [], rooms: [], lightboxes: [] }, storage);
    reloaded.start();
    expect(reloaded.doc.strokes.has('odd')).toBe(true);
    reloaded.stop();
  });
});
