// The editor page asks for its pass's strokes before the editor's own code (the canvas
// library) is there: from its HTML (pass-early-read.tsx) or, reached by navigating inside
// the app, as soon as it is hydrated. The editor's first read takes that answer instead
// of asking again.
import { PASS_MEDIA_TYPE } from '@/lib/strokes/wire';
import { withOutlines } from './outline-prefetch';

/** Must match EARLY_READS in pass-early-read.tsx (a server module, not imported here). */
const EARLY_READS = '__quadrillePassReads';
type EarlyReads = Record<string, Promise<Response> | undefined>;

/** The read the page's HTML started, if any; taken once. */
function fromHtml(passId: string): Promise<Response> | undefined {
  const reads = (window as unknown as Record<string, EarlyReads | undefined>)[EARLY_READS];
  const p = reads?.[passId];
  if (reads) delete reads[passId];
  return p;
}

const early = new Map<string, Promise<Response>>();

// The reads the page's HTML started are handed, as this module loads with the page's scripts, to
// the outline worker too: it works on them while the page hydrates.
if (typeof window !== 'undefined') {
  const reads = (window as unknown as Record<string, EarlyReads | undefined>)[EARLY_READS];
  for (const [id, p] of Object.entries(reads ?? {})) if (p && reads) reads[id] = p.then(withOutlines);
}

export function passRequest(passId: string): Promise<Response> {
  return fetch(`/api/passes/${passId}`, { cache: 'no-store', headers: { accept: PASS_MEDIA_TYPE } });
}

/** Starts reading the pass now (once per pass and page). */
export function prefetchPass(passId: string): void {
  if (!early.has(passId)) early.set(passId, fromHtml(passId) ?? passRequest(passId).then(withOutlines));
}

/** The read started early, if there is one; it is given out once. */
export function takePrefetched(passId: string): Promise<Response> | undefined {
  const p = early.get(passId) ?? fromHtml(passId);
  early.delete(passId);
  return p;
}
