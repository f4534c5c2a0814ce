import { passDelta, passState } from '@/db/queries/passes';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byPassId } from '@/lib/http/series-of';

type Params = { passId: string };
const seriesOf = byPassId;

/** The whole pass, or with `?since=seq` only what changed after that sequence number. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ req, db, params }) => {
  const since = new URL(req.url).searchParams.get('since');
  if (since !== null) {
    const n = Number(since);
    if (!Number.isInteger(n) || n < 0) return jsonError(422, '"since" must be a sequence number (0 or more).');
    return Response.json(await passDelta(db, params.passId, n));
  }
  return Response.json(await passState(db, params.passId));
});
