import { acceptInvitation } from '@/db/queries/members';
import { withUser } from '@/lib/http/route';
import { seriesChanged } from '@/lib/live/events';

/**
 * The signed-in person joins the series with the invited role. 410 when used or expired; 403 when the invitation
 * was sent to another address (the answer names it, partly masked) and is not a link anyone may use.
 */
export const POST = withUser<{ token: string }>(async ({ db, params, user }) => {
  const joined = await acceptInvitation(db, params.token, user.id);
  await seriesChanged(joined.seriesId, ['members', 'activity']);
  return Response.json(joined);
});
