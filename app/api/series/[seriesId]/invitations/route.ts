import { createInvitation, listInvitations } from '@/db/queries/members';
import { findSeries } from '@/db/queries/series';
import { invitationMail } from '@/lib/mail/templates';
import { appUrl } from '@/lib/mail/notify';
import { sendMail } from '@/lib/mail/transport';
import { withSeriesRole } from '@/lib/http/route';
import { inviteSchema } from '@/lib/validation/members';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

/** Pending invitations (owners). */
export const GET = withSeriesRole<Params>('manage', seriesOf, async ({ db, seriesId }) => Response.json(await listInvitations(db, seriesId)));

/**
 * `{ email, role, anyoneWithLink? }` → 201; the invitation goes out by e-mail with a one-time link valid 7 days, which
 * only the account with that address may accept — unless `anyoneWithLink` is true.
 */
export const POST = withSeriesRole<Params, typeof inviteSchema>('manage', seriesOf, { body: inviteSchema }, async ({ db, seriesId, user, body }) => {
  const input = body;
  const inv = await createInvitation(db, {
    seriesId,
    email: input.email,
    role: input.role,
    invitedBy: user.id,
    anyoneWithLink: input.anyoneWithLink,
  });
  const series = await findSeries(db, seriesId);
  const sent = await sendMail(
    db,
    input.email,
    'invitation',
    invitationMail({
      seriesTitle: series!.title,
      inviter: user.name,
      role: input.role,
      link: `${appUrl()}/invite/${inv.token}`,
      expiresAt: inv.expiresAt,
      forAddress: input.anyoneWithLink ? null : input.email,
    }),
  );
  return Response.json(
    {
      id: inv.id,
      email: input.email,
      role: input.role,
      anyoneWithLink: input.anyoneWithLink,
      expiresAt: inv.expiresAt.toISOString(),
      mailed: sent.ok,
    },
    { status: 201 },
  );
});
