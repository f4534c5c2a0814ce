// A final page's files, only to members of its series: the kept scan (for printing),
// the screen copy (≤ 2,048 px) and the preview (≤ 320 px). The kept scan streams.
import { Readable } from 'node:stream';
import { finalPageRow } from '@/db/queries/final-pages';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byFinalPageId } from '@/lib/http/series-of';
import { getObjectStream } from '@/lib/storage/s3';

type Params = { finalPageId: string; variant: string };
const seriesOf = byFinalPageId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const row = await finalPageRow(db, params.finalPageId);
  const key = { kept: row?.keptKey, display: row?.displayKey, preview: row?.previewKey }[params.variant as 'kept'];
  if (!row || !key) return jsonError(404, 'Not found: the variants are kept, display and preview.');
  const obj = await getObjectStream(key);
  if (!obj) return jsonError(404, 'Not found.');
  const ext = key.slice(key.lastIndexOf('.') + 1);
  return new Response(Readable.toWeb(obj.body) as ReadableStream, {
    headers: {
      'content-type': obj.contentType,
      'content-length': String(obj.bytes),
      // no-cache: a member removed from the series must not keep reading it from the browser's cache.
      'cache-control': 'private, no-cache',
      ...(params.variant === 'kept' ? { 'content-disposition': `attachment; filename="final-page-${row.id.slice(0, 8)}.${ext}"` } : {}),
    },
  });
});
