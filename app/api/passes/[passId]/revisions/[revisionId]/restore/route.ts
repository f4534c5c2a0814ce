import { restoreRevision } from '@/db/queries/passes';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byPassId } from '@/lib/http/series-of';

type Params = { passId: string; revisionId: string };
const seriesOf = byPassId;

/** Restores a revision as a new state of the pass; the state before is kept as a revision. */
export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ db, params, user }) => {
  const done = await restoreRevision(db, { passId: params.passId, revisionId: params.revisionId, userId: user.id });
  if (!done) return jsonError(404, 'Not found.');
  return Response.json(done);
});
