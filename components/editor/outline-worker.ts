// A worker thread of the editor page: reads a pass's packed strokes (the same bytes the editor
// reads) and computes their outlines — the perfect-freehand work that is most of drawing a
// pass — on the browser's other core while the page's own thread hydrates. Each chunk's
// outlines go back as flat arrays, moved rather than copied (outline-prefetch.ts).
import { PassReader } from '@/lib/strokes/wire';
import { type OutlineChunk, packOutlines } from './outline-pack';

const post = (m: OutlineChunk | { done: true } | { failed: true }, transfer: Transferable[] = []) =>
  (self as unknown as { postMessage(m: unknown, t: Transferable[]): void }).postMessage(m, transfer);

self.onmessage = async (e: MessageEvent<{ body: ReadableStream<Uint8Array> }>) => {
  try {
    const reader = new PassReader();
    const source = e.data.body.getReader();
    for (;;) {
      const { done, value } = await source.read();
      if (done) break;
      const strokes = reader.push(value);
      if (!strokes.length) continue;
      const c = packOutlines(strokes);
      post(c, [c.polygons.buffer, c.points.buffer, c.coords.buffer, c.firsts.buffer, c.counts.buffer]);
    }
    post({ done: true });
  } catch {
    post({ failed: true });
  }
};
