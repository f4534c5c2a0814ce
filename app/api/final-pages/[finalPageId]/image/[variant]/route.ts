// A final page's files, only to members of its series: the kept scan (for printing),
// the screen copy (≤ 2,048 px) and the preview (≤ 320 px). The kept scan streams.
import { finalPageRow } from '@/db/queries/final-pages';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byFinalPageId } from '@/lib/http/series-of';
import { objectResponse } from '@/lib/storage/s3';

type Params = { finalPageId: string; variant: string };
const seriesOf = byFinalPageId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const row = await finalPageRow(db, params.finalPageId);
  const key = { kept: row?.keptKey, display: row?.displayKey, preview: row?.previewKey }[params.variant as 'kept'];
  if (!row || !key) return jsonError(404, 'Not found: the variants are kept, display and preview.');
  const ext = key.slice(key.lastIndexOf('.') + 1);
  const filename = params.variant === 'kept' ? `final-page-${row.id.slice(0, 8)}.${ext}` : undefined;
  return (await objectResponse(key, { filename })) ?? jsonError(404, 'Not found.');
});
