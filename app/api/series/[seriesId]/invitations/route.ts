import { createInvitation, listInvitations } from '@/db/queries/members';
import { sendInvitation } from '@/lib/mail/notify';
import { withSeriesRole } from '@/lib/http/route';
import { inviteSchema } from '@/lib/validation/members';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

/** Invitations not yet accepted nor withdrawn, expired ones flagged (owners). */
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
  const sent = await sendInvitation(db, {
    seriesId,
    inviter: user.name,
    email: input.email,
    role: input.role,
    token: inv.token,
    expiresAt: inv.expiresAt,
    anyoneWithLink: input.anyoneWithLink,
  });
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
