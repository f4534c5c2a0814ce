import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { AcceptInvitation } from '@/components/members/accept-invitation';
import { getDb } from '@/db/client';
import { invitationByToken, invitationGone, invitationRefusal, maskEmail } from '@/db/queries/members';
import { ROLE_LABELS } from '@/lib/auth/permissions';
import { currentUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Invitation' };
export const dynamic = 'force-dynamic';

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const inv = await invitationByToken(await getDb(), token);
  if (!inv) notFound();
  const user = await currentUser();
  const wrongAccount = user ? invitationRefusal(inv, user.email) : null;
  // Used, withdrawn, sent again or expired: the page says which (accepting it answers 410).
  // A server component renders once per request: "now" is that request's time.
  // eslint-disable-next-line react-hooks/purity -- the check belongs to this request, not to a re-render
  const problem = invitationGone(inv, Date.now()) ?? wrongAccount;
  return (
    <AcceptInvitation
      token={token}
      signedIn={!!user}
      seriesTitle={inv.seriesTitle}
      role={ROLE_LABELS[inv.role].toLowerCase()}
      invitedBy={inv.invitedBy}
      // Shown partly masked: whoever holds the link learns whom it is for, not the whole address.
      sentTo={inv.anyoneWithLink === 1 ? null : maskEmail(inv.email)}
      problem={problem}
      wrongAccount={!!wrongAccount && problem === wrongAccount}
    />
  );
}
