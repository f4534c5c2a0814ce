import { changeRole, listMembers, removeMember } from '@/db/queries/members';
import { withSeriesRole } from '@/lib/http/route';
import { roleSchema } from '@/lib/validation/members';
import { bySeriesId } from '@/lib/http/series-of';
import { accessChanged } from '@/lib/live/events';

type Params = { seriesId: string; userId: string };
const seriesOf = bySeriesId;

/** Owners change a member's role (`{ role }`); the last owner stays an owner. */
export const PATCH = withSeriesRole<Params, typeof roleSchema>('manage', seriesOf, { body: roleSchema }, async ({ db, seriesId, params, body }) => {
  const { role } = body;
  await changeRole(db, seriesId, params.userId, role);
  await accessChanged(seriesId, params.userId);
  return Response.json((await listMembers(db, seriesId)).find((m) => m.userId === params.userId));
});

/** Owners remove a member; never the last owner. */
export const DELETE = withSeriesRole<Params>('manage', seriesOf, async ({ db, seriesId, params }) => {
  await removeMember(db, seriesId, params.userId);
  await accessChanged(seriesId, params.userId);
  return new Response(null, { status: 204 });
});
