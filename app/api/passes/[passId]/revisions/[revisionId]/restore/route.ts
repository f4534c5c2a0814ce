import { restoreRevision, seriesOfPass } from '@/db/queries/passes';
import { jsonError, withSeriesRole } from '@/lib/http/route';

type Params = { passId: string; revisionId: string };
const seriesOf = (p: Params, db: Parameters<typeof seriesOfPass>[0]) => seriesOfPass(db, p.passId);

/** Restores a revision as a new state of the pass; the state before is kept as a revision. */
export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ db, params, user }) => {
  const done = await restoreRevision(db, { passId: params.passId, revisionId: params.revisionId, userId: user.id });
  if (!done) return jsonError(404, 'Not found.');
  return Response.json(done);
});
