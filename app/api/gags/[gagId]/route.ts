import { recordActivity } from '@/db/queries/activity';
import { deleteGag, findGag, updateGag } from '@/db/queries/gags';
import { checkManualMove } from '@/lib/gags/status';
import { Refused, parseBody, withSeriesRole } from '@/lib/http/route';
import { updateGagSchema } from '@/lib/validation/gag';
import { byGagId } from '@/lib/http/series-of';
import { gagChanged } from '@/lib/live/events';

type Params = { gagId: string };
const seriesOf = byGagId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await findGag(db, params.gagId)));

/** Any of title, premise, status, beats. Status moves follow lib/gags/status. */
export const PATCH = withSeriesRole<Params>('edit', seriesOf, async ({ req, db, params, seriesId }) => {
  const patch = await parseBody(req, updateGagSchema);
  await db.transaction().execute(async (trx) => {
    const current = await trx.selectFrom('gags').select('status').where('id', '=', params.gagId).executeTakeFirst();
    if (!current) throw new Refused(404, 'Not found.');
    if (patch.status) {
      const check = checkManualMove(current.status, patch.status);
      if (!check.ok) {
        throw new Refused(422, check.reason, [{ path: ['status'], message: check.reason, code: 'invalid_move' }]);
      }
    }
    await updateGag(trx, params.gagId, patch);
  });
  await gagChanged(seriesId, params.gagId, ['gag'], ['gags']);
  return Response.json(await findGag(db, params.gagId));
});

/** Owners only: deleting is part of "manage". */
export const DELETE = withSeriesRole<Params>('manage', seriesOf, async ({ db, params, seriesId, user }) => {
  const gag = await findGag(db, params.gagId);
  await db.transaction().execute(async (trx) => {
    await deleteGag(trx, params.gagId);
    await recordActivity(trx, { seriesId, userId: user.id, kind: 'gag.deleted', summary: `deleted the gag “${gag?.title ?? ''}”` });
  });
  await gagChanged(seriesId, params.gagId, ['gag'], ['gags', 'activity']);
  return new Response(null, { status: 204 });
});
