import { findPass, liveLightboxes, liveRooms, liveStrokeRows, passDelta, passState } from '@/db/queries/passes';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byPassId } from '@/lib/http/series-of';
import { remembered } from '@/lib/remembered';
import { END, PASS_MEDIA_TYPE, encodeHeader, encodeStrokes } from '@/lib/strokes/wire';

type Params = { passId: string };
const seriesOf = byPassId;

// Kept as UTF-8 bytes with their length: each answer is then a copy to the socket, not a string encoded again.
const asJson = remembered<Buffer | null>({ maxBytes: 32 * 1024 * 1024, sizeOf: (b) => b?.byteLength ?? 0 });

/** Strokes per chunk of the packed answer: the editor draws each chunk as it arrives. */
const STROKES_PER_CHUNK = 500;

/**
 * The whole pass, or with `?since=seq` only what changed after that sequence
 * number. JSON by default; the whole pass packed (lib/strokes/wire.ts) when the
 * request accepts `application/vnd.quadrille.pass`, as the editor does.
 */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ req, db, params }) => {
  const since = new URL(req.url).searchParams.get('since');
  if (since !== null) {
    const n = Number(since);
    if (!Number.isInteger(n) || n < 0) return jsonError(422, '"since" must be a sequence number (0 or more).');
    return Response.json(await passDelta(db, params.passId, n));
  }
  if (!(req.headers.get('accept') ?? '').includes(PASS_MEDIA_TYPE)) {
    // The JSON of a pass at a seq never changes: made once, then served as it is.
    const at = await findPass(db, params.passId);
    if (!at) return jsonError(404, 'Not found.');
    const body = await asJson.get(`${params.passId}:${at.seq}`, async () => {
      const state = await passState(db, params.passId);
      return state && state.seq === at.seq ? Buffer.from(JSON.stringify(state)) : null;
    });
    // A batch landed between the two reads: answer the newer state, unremembered.
    const fresh = body === null ? await passState(db, params.passId) : null;
    if (body === null && !fresh) return jsonError(404, 'Not found.');
    const bytes = body ?? Buffer.from(JSON.stringify(fresh));
    return new Response(new Uint8Array(bytes.buffer as ArrayBuffer, bytes.byteOffset, bytes.byteLength), {
      headers: { 'content-type': 'application/json', 'content-length': String(bytes.byteLength), vary: 'Accept' },
    });
  }

  const pass = await findPass(db, params.passId);
  if (!pass) return jsonError(404, 'Not found.');
  const rows = await liveStrokeRows(db, params.passId);
  const header = encodeHeader({
    id: pass.id,
    gagId: pass.gagId,
    number: pass.number,
    seq: pass.seq,
    strokeCount: rows.length,
    rooms: await liveRooms(db, params.passId),
    lightboxes: await liveLightboxes(db, params.passId),
  });
  let next = 0;
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(header);
    },
    // One chunk per pull, so a slow reader holds back the encoding rather than piling it up.
    pull(controller) {
      if (next >= rows.length) {
        controller.enqueue(END);
        controller.close();
        return;
      }
      const run = rows.slice(next, next + STROKES_PER_CHUNK).map((r) => ({ ...r, points: r.points as Uint8Array }));
      next += STROKES_PER_CHUNK;
      controller.enqueue(encodeStrokes(run));
    },
  });
  return new Response(body, { headers: { 'content-type': PASS_MEDIA_TYPE, vary: 'Accept', 'cache-control': 'private, no-store' } });
});
