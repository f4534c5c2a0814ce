// The outlines of a pass's strokes, computed in a worker (outline-worker.ts) from a copy of the
// bytes the editor reads, while the page's own thread is busy hydrating. The editor's bitmaps
// take an outline from here when it is ready and belongs to the same stroke (same id, same first
// point, same number of points: a moved stroke is not the one it was computed for), and compute
// it themselves otherwise: nothing waits for the worker.
import type { Stroke } from '@/lib/strokes/types';
import { type FlatOutline, type KeptOutline, type OutlineChunk, outlineFits, unpackOutlines } from './outline-pack';

const kept = new Map<string, KeptOutline>();

/** The worker's outline of this very stroke, given out once; undefined when there is none (yet). */
export function takeOutline(stroke: Stroke): FlatOutline | undefined {
  const k = kept.get(stroke.id);
  if (!k) return undefined;
  kept.delete(stroke.id);
  return outlineFits(k, stroke) ? k : undefined;
}

/**
 * Hands a copy of the pass's bytes to a new outline worker and gives back the response for the
 * editor to read (the other copy). Without workers, or on any trouble, the response as it was.
 */
export function withOutlines(res: Response): Response {
  if (typeof Worker === 'undefined' || !res.ok || !res.body) return res;
  try {
    const worker = new Worker(new URL('./outline-worker.ts', import.meta.url));
    const [mine, theirs] = res.body.tee();
    worker.onmessage = (e: MessageEvent<OutlineChunk | { done: true } | { failed: true }>) => {
      if ('ids' in e.data) unpackOutlines(e.data, kept);
      else worker.terminate();
    };
    worker.onerror = () => worker.terminate();
    worker.postMessage({ body: theirs }, [theirs]);
    return new Response(mine, { status: res.status, statusText: res.statusText, headers: res.headers });
  } catch {
    return res;
  }
}
