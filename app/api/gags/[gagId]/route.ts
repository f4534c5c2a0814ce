import { findGag, patchGag, removeGag } from '@/db/queries/gags';
import { withSeriesRole } from '@/lib/http/route';
import { updateGagSchema } from '@/lib/validation/gag';
import { byGagId } from '@/lib/http/series-of';
import { gagChanged } from '@/lib/live/events';

type Params = { gagId: string };
const seriesOf = byGagId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await findGag(db, params.gagId)));

/** Any of title, premise, status, beats. Status moves follow lib/gags/status and are told in the activity. */
export const PATCH = withSeriesRole<Params, typeof updateGagSchema>(
  'edit',
  seriesOf,
  { body: updateGagSchema },
  async ({ db, params, seriesId, user, body }) => {
    const { moved } = await patchGag(db, params.gagId, body, user.id);
    // A hand move may clear a "ready" stamp (its mark on the pass cards) and is told in the activity.
    if (moved) await gagChanged(seriesId, params.gagId, ['gag', 'stamps'], ['gags', 'activity']);
    else await gagChanged(seriesId, params.gagId, ['gag'], ['gags']);
    return Response.json(await findGag(db, params.gagId));
  },
);

/** Owners only: deleting is part of "manage". */
export const DELETE = withSeriesRole<Params>('manage', seriesOf, async ({ db, params, seriesId, user }) => {
  await removeGag(db, { gagId: params.gagId, seriesId, userId: user.id });
  await gagChanged(seriesId, params.gagId, ['gag'], ['gags', 'activity']);
  return new Response(null, { status: 204 });
});
