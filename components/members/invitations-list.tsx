'use client';
// The series' invitations not yet accepted: each can be sent again (a new e-mail with a fresh link;
// the old link stops working) or withdrawn (its link stops working), expired ones too.
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import type { InvitationDto } from '@/hooks/use-members';
import { ROLE_LABELS } from '@/lib/auth/permissions';

export function InvitationsList({
  invitations,
  act,
  resend,
  revoke,
}: {
  invitations: InvitationDto[];
  act: (fn: () => Promise<unknown>, ok: string) => Promise<void>;
  resend: (id: string) => Promise<unknown>;
  revoke: (id: string) => Promise<unknown>;
}) {
  const [withdrawing, setWithdrawing] = useState<InvitationDto | null>(null);
  if (invitations.length === 0) return null;
  return (
    <>
      <h3 className="pt-2 text-lg font-extrabold">Not yet accepted</h3>
      <ul className="divide-y divide-paper-edge/60 text-sm" data-testid="invitations">
        {invitations.map((i) => (
          <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <strong>{i.email}</strong>
              {i.anyoneWithLink ? ' (open link: anyone who has it)' : ''} as {ROLE_LABELS[i.role]} — invited by {i.invitedBy},{' '}
              {i.expired ? (
                <strong>expired</strong>
              ) : (
                <>
                  until <span suppressHydrationWarning>{new Date(i.expiresAt).toLocaleDateString()}</span>
                </>
              )}
            </span>
            <span className="flex gap-1">
              <Button
                variant="secondary"
                aria-label={`Send the invitation to ${i.email} again`}
                onClick={() => void act(() => resend(i.id), `Sent again to ${i.email}, with a new link valid 7 days; the old link no longer works.`)}
              >
                Send again
              </Button>
              <Button variant="ghost" className="text-stamp" aria-label={`Withdraw the invitation to ${i.email}`} onClick={() => setWithdrawing(i)}>
                Withdraw
              </Button>
            </span>
          </li>
        ))}
      </ul>
      <ConfirmDialog
        open={withdrawing !== null}
        title={`Withdraw the invitation to ${withdrawing?.email ?? ''}?`}
        body={<p>Its link stops working at once. You can invite the address again later.</p>}
        confirmLabel="Withdraw"
        onCancel={() => setWithdrawing(null)}
        onConfirm={() => {
          const i = withdrawing!;
          setWithdrawing(null);
          void act(() => revoke(i.id), `The invitation to ${i.email} was withdrawn.`);
        }}
      />
    </>
  );
}
