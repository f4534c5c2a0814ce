// A pass as an SVG page, for the board's cards (the same geometry as the editor).
// Drawn in a worker thread and kept by seq: a big pass costs its drawing once.
import { promisify } from 'node:util';
import { gunzip } from 'node:zlib';
import { findPass } from '@/db/queries/passes';
import { pageSpecForPass } from '@/db/queries/series';
import { withSeriesRole } from '@/lib/http/route';
import { byPassId } from '@/lib/http/series-of';
import { remembered } from '@/lib/remembered';
import { runHeavy } from '@/lib/workers/pool';

type Params = { passId: string };
const gunzipAsync = promisify(gunzip);
const seriesOf = byPassId;

type Drawn = Uint8Array | null;
const drawn = remembered<Drawn>({ maxBytes: 64 * 1024 * 1024, sizeOf: (d) => d?.byteLength ?? 0 });

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ req, db, params, seriesId }) => {
  const pass = await findPass(db, params.passId);
  if (!pass) return new Response(null, { status: 404 });
  const spec = await pageSpecForPass(db, seriesId, params.passId);
  const key = `${params.passId}:${pass.seq}:${JSON.stringify(spec)}`;
  const result = await drawn.get(key, () => runHeavy('thumbnail', { passId: params.passId, seriesId }));
  if (!result) return new Response(null, { status: 404 });
  // The SVG comes gzipped from the worker; the rare client that takes no gzip gets it unpacked (off this thread too).
  const gzip = /\bgzip\b/.test(req.headers.get('accept-encoding') ?? '');
  const body = gzip ? result : await gunzipAsync(result);
  return new Response(body as Uint8Array<ArrayBuffer>, {
    headers: {
      'content-type': 'image/svg+xml; charset=utf-8',
      ...(gzip ? { 'content-encoding': 'gzip' } : {}),
      vary: 'Accept-Encoding',
      'cache-control': 'private, max-age=0, must-revalidate',
    },
  });
});
