import { listActivity } from '@/db/queries/activity';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

/** Newest first, 20 a page: `?before=<id>` for the next page; `limit` up to 100. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ req, db, seriesId }) => {
  const url = new URL(req.url);
  const before = url.searchParams.get('before');
  const limit = url.searchParams.get('limit');
  const b = before === null ? undefined : Number(before);
  const l = limit === null ? undefined : Number(limit);
  if ((b !== undefined && !Number.isInteger(b)) || (l !== undefined && !Number.isInteger(l))) {
    return jsonError(422, '"before" and "limit" are whole numbers.');
  }
  return Response.json(await listActivity(db, seriesId, { before: b, limit: l }));
});
