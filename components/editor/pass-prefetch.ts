// The editor page asks for its pass's strokes as soon as it is hydrated, while
// the editor's own code (the canvas library) is still on its way; the editor's
// first read then takes that answer instead of asking again.
import { PASS_MEDIA_TYPE } from '@/lib/strokes/wire';

const early = new Map<string, Promise<Response>>();

export function passRequest(passId: string): Promise<Response> {
  return fetch(`/api/passes/${passId}`, { cache: 'no-store', headers: { accept: PASS_MEDIA_TYPE } });
}

/** Starts reading the pass now (once per pass and page). */
export function prefetchPass(passId: string): void {
  if (!early.has(passId)) early.set(passId, passRequest(passId));
}

/** The read started early, if there is one; it is given out once. */
export function takePrefetched(passId: string): Promise<Response> | undefined {
  const p = early.get(passId);
  early.delete(passId);
  return p;
}
