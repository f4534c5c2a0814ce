'use client';
// Members, roles and invitations of a series. Owners manage; others see who is in.
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import type { MemberDto } from '@/db/queries/members';
import { memberActions, useInvitations, useMe, useMembers } from '@/hooks/use-members';
import { ROLES, ROLE_HINT, ROLE_LABELS, type Role } from '@/lib/auth/permissions';
import { messageOf } from '@/lib/http/client';
import { lazyZodResolver } from '@/lib/forms/lazy-resolver';
import type { inviteSchema } from '@/lib/validation/members';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { InvitationsList } from './invitations-list';

/** Why a member cannot be removed or stop being an owner: the series keeps at least one owner. */
const LAST_OWNER = 'The series keeps at least one owner: make another member owner first.';

export function MembersPage({ seriesId, seriesTitle, canManage, meId }: { seriesId: string; seriesTitle: string; canManage: boolean; meId: string }) {
  const { data: members, mutate } = useMembers(seriesId);
  const invitations = useInvitations(seriesId, canManage);
  const me = useMe();
  const actions = memberActions(seriesId);
  const [message, setMessage] = useState<string | null>(null);
  const [removing, setRemoving] = useState<MemberDto | null>(null);
  const router = useRouter();
  const owners = (members ?? []).filter((m) => m.role === 'owner').length;
  const lastOwner = (m: MemberDto) => m.role === 'owner' && owners <= 1;
  const form = useForm<z.input<typeof inviteSchema>>({
    resolver: lazyZodResolver(() => import('@/lib/validation/members').then((m) => m.inviteSchema)),
    defaultValues: { email: '', role: 'viewer', anyoneWithLink: false },
  });

  const act = async (fn: () => Promise<unknown>, ok: string) => {
    setMessage(null);
    try {
      await fn();
      setMessage(ok);
      await mutate();
      await invitations.mutate();
    } catch (err) {
      setMessage(messageOf(err, 'That did not work.'));
    }
  };

  const invite = form.handleSubmit((v) =>
    act(async () => {
      await actions.invite(v);
      form.reset({ email: '', role: v.role, anyoneWithLink: false });
    }, `Invitation sent to ${v.email}.`),
  );

  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm text-graphite-faint">{seriesTitle} / members</p>
        <h1 className="text-3xl font-extrabold">Members</h1>
      </div>
      {message && (
        <p role="status" className="rounded-md bg-ink-light px-3 py-2 text-sm text-ink">
          {message}
        </p>
      )}
      <section className="panel overflow-x-auto">
        {canManage && <p className="px-3 pt-3 text-sm text-graphite-soft">{ROLE_HINT}</p>}
        <table className="w-full min-w-[560px] text-left text-sm">
          <thead className="border-b border-paper-edge bg-paper-deep/60">
            <tr>
              <th className="px-3 py-2">Name</th>
              <th className="px-3 py-2">E-mail</th>
              <th className="px-3 py-2">Role</th>
              {canManage && (
                <th className="px-3 py-2">
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {(members ?? []).map((m: MemberDto) => (
              <tr key={m.userId} className="border-b border-paper-edge/60 last:border-0">
                <td className="px-3 py-2 font-bold">
                  {m.name}
                  {m.userId === meId ? ' (you)' : ''}
                </td>
                <td className="px-3 py-2">{m.email}</td>
                <td className="px-3 py-2">
                  {canManage ? (
                    <select
                      aria-label={`Role of ${m.name}`}
                      className="field w-auto py-1"
                      value={m.role}
                      onChange={(e) =>
                        void act(
                          () => actions.changeRole(m.userId, e.target.value as Role),
                          `${m.name} is now ${ROLE_LABELS[e.target.value as Role]}.`,
                        )
                      }
                    >
                      {ROLES.map((r) => (
                        <option key={r} value={r} disabled={lastOwner(m) && r !== 'owner'}>
                          {ROLE_LABELS[r]}
                        </option>
                      ))}
                    </select>
                  ) : (
                    ROLE_LABELS[m.role]
                  )}
                </td>
                {canManage && (
                  <td className="px-3 py-2 text-right">
                    <Button
                      variant="ghost"
                      className="text-stamp"
                      disabled={lastOwner(m)}
                      aria-describedby={lastOwner(m) ? `last-owner-${m.userId}` : undefined}
                      onClick={() => setRemoving(m)}
                    >
                      Remove{m.userId === meId ? ' me' : ''}
                    </Button>
                    {lastOwner(m) && (
                      <span id={`last-owner-${m.userId}`} className="block text-xs text-graphite-faint">
                        {m.userId === meId ? 'You are the last owner. ' : 'The last owner. '}
                        {LAST_OWNER}
                      </span>
                    )}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
        <ConfirmDialog
          open={removing !== null}
          title={removing?.userId === meId ? `Leave “${seriesTitle}”?` : `Remove ${removing?.name ?? ''} from “${seriesTitle}”?`}
          body={<p>{removing?.userId === meId ? 'You will no longer see this series.' : 'They will no longer see this series.'}</p>}
          confirmLabel={removing?.userId === meId ? 'Leave the series' : 'Remove'}
          onCancel={() => setRemoving(null)}
          onConfirm={() => {
            const m = removing!;
            setRemoving(null);
            if (m.userId !== meId) return void act(() => actions.remove(m.userId), `${m.name} was removed.`);
            // Leaving: nothing of this series is mine to see any more.
            actions.remove(m.userId).then(
              () => router.push('/series'),
              (err: unknown) => setMessage(messageOf(err, 'That did not work.')),
            );
          }}
        />
      </section>

      {canManage && (
        <section className="panel space-y-3 p-4" aria-labelledby="invite-title">
          <h2 id="invite-title" className="text-xl font-extrabold">
            Invite someone
          </h2>
          <form onSubmit={invite} noValidate className="flex flex-wrap items-end gap-3">
            <Field id="invite-email" label="E-mail" error={form.formState.errors.email?.message}>
              <input id="invite-email" type="email" className="field w-72" {...form.register('email')} />
            </Field>
            <Field id="invite-role" label="Role">
              <select id="invite-role" className="field w-auto" {...form.register('role')}>
                {ROLES.map((r) => (
                  <option key={r} value={r}>
                    {ROLE_LABELS[r]}
                  </option>
                ))}
              </select>
            </Field>
            <Button type="submit" disabled={form.formState.isSubmitting}>
              Send invitation
            </Button>
            <label className="flex basis-full items-start gap-2 text-sm">
              <input type="checkbox" className="mt-1" aria-describedby="open-link-hint" {...form.register('anyoneWithLink')} />
              <span>
                Anyone who has the link may join, not only the person with this e-mail address
                <span id="open-link-hint" className="block text-xs text-graphite-faint">
                  Leave it unticked unless you will share the link yourself: a forwarded e-mail then lets someone else in.
                </span>
              </span>
            </label>
          </form>
          <p className="text-sm text-graphite-soft" id="role-hint">
            {ROLE_HINT}
          </p>
          <p className="text-xs text-graphite-faint">The link works once and for 7 days.</p>
          <InvitationsList invitations={invitations.data ?? []} act={act} resend={actions.resend} revoke={actions.revoke} />
        </section>
      )}

      <section id="notifications" className="panel scroll-mt-4 p-4" aria-labelledby="notify-title">
        <h2 id="notify-title" className="text-xl font-extrabold">
          Notifications
        </h2>
        <label className="mt-2 flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={me.data?.notifyEmail ?? true}
            onChange={(e) =>
              void act(
                async () => {
                  await me.setNotifyEmail(e.target.checked);
                  await me.mutate();
                },
                e.target.checked ? 'E-mail notifications on.' : 'E-mail notifications off.',
              )
            }
          />
          E-mail me when I am mentioned or a gag I started is stamped
        </label>
      </section>
    </div>
  );
}
