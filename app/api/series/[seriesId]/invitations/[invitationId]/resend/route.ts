import { resendInvitation } from '@/db/queries/invitation-changes';
import { withSeriesRole } from '@/lib/http/route';
import { bySeriesId } from '@/lib/http/series-of';
import { seriesChanged } from '@/lib/live/events';
import { sendInvitation } from '@/lib/mail/notify';

type Params = { seriesId: string; invitationId: string };

/**
 * Owners send an invitation again (expired or not) → 201 with the new invitation: a fresh link valid 7
 * days goes out by e-mail; the old link answers 410, saying to use the newer e-mail.
 */
export const POST = withSeriesRole<Params>('manage', bySeriesId, async ({ db, seriesId, params, user }) => {
  const inv = await resendInvitation(db, { seriesId, invitationId: params.invitationId, invitedBy: user.id });
  const sent = await sendInvitation(db, { seriesId, inviter: user.name, ...inv });
  await seriesChanged(seriesId, ['members']);
  return Response.json(
    { id: inv.id, email: inv.email, role: inv.role, anyoneWithLink: inv.anyoneWithLink, expiresAt: inv.expiresAt.toISOString(), mailed: sent.ok },
    { status: 201 },
  );
});
