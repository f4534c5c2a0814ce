import { revokeInvitation } from '@/db/queries/invitation-changes';
import { withSeriesRole } from '@/lib/http/route';
import { bySeriesId } from '@/lib/http/series-of';
import { seriesChanged } from '@/lib/live/events';

type Params = { seriesId: string; invitationId: string };

/** Owners withdraw an invitation not yet accepted → 204; its link then answers 410. 409 once accepted. */
export const DELETE = withSeriesRole<Params>('manage', bySeriesId, async ({ db, seriesId, params }) => {
  await revokeInvitation(db, seriesId, params.invitationId);
  await seriesChanged(seriesId, ['members']);
  return new Response(null, { status: 204 });
});
