import { restoreRevision } from '@/db/queries/revisions';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byPassId } from '@/lib/http/series-of';
import { passWithGag } from '@/db/queries/pass-info';
import { passChanged } from '@/lib/live/events';

type Params = { passId: string; revisionId: string };
const seriesOf = byPassId;

/** Restores a revision as a new state of the pass; the state before is kept as a revision. */
export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ db, params, user, seriesId }) => {
  const done = await restoreRevision(db, { passId: params.passId, revisionId: params.revisionId, userId: user.id });
  if (!done) return jsonError(404, 'Not found.');
  const gagId = (await passWithGag(db, params.passId))!.gagId;
  await passChanged({ seriesId, gagId, passId: params.passId, seq: done.seq, stampCleared: true });
  return Response.json(done);
});
