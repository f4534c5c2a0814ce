'use client';
// Who is in a series, who is invited, and my own settings.
import useSWR from 'swr';
import type { MemberDto } from '@/db/queries/members';
import type { Role } from '@/lib/auth/permissions';
import { api, fetcher } from '@/lib/http/client';

export type InvitationDto = {
  id: string;
  email: string;
  role: Role;
  anyoneWithLink: boolean;
  expiresAt: string;
  invitedBy: string;
  /** Past its 7 days: it can still be sent again (or withdrawn). */
  expired: boolean;
};

export function useMembers(seriesId: string | null) {
  return useSWR<MemberDto[]>(seriesId ? `/api/series/${seriesId}/members` : null, fetcher);
}

/** Pending invitations; owners only (`enabled` false asks nothing). */
export function useInvitations(seriesId: string, enabled: boolean) {
  return useSWR<InvitationDto[]>(enabled ? `/api/series/${seriesId}/invitations` : null, fetcher);
}

export function useMe() {
  const swr = useSWR<{ id: string; name: string; email: string; notifyEmail: boolean }>('/api/me', fetcher);
  async function setNotifyEmail(notifyEmail: boolean) {
    await api('/api/me', { method: 'PATCH', json: { notifyEmail } });
    await swr.mutate();
  }
  return { ...swr, setNotifyEmail };
}

/** What an owner does on the members page. */
export function memberActions(seriesId: string) {
  return {
    invite: (input: { email: string; role: Role; anyoneWithLink?: boolean }) =>
      api(`/api/series/${seriesId}/invitations`, { method: 'POST', json: input }),
    changeRole: (userId: string, role: Role) => api(`/api/series/${seriesId}/members/${userId}`, { method: 'PATCH', json: { role } }),
    remove: (userId: string) => api(`/api/series/${seriesId}/members/${userId}`, { method: 'DELETE' }),
    /** Withdraws an invitation: its link stops working. */
    revoke: (invitationId: string) => api(`/api/series/${seriesId}/invitations/${invitationId}`, { method: 'DELETE' }),
    /** Sends it again with a fresh link, valid 7 days from now; the old link stops working. */
    resend: (invitationId: string) =>
      api<{ email: string; mailed: boolean }>(`/api/series/${seriesId}/invitations/${invitationId}/resend`, { method: 'POST' }),
  };
}

/** A new password (the current one too); every other session of mine ends. */
export function changePassword(input: { currentPassword: string; newPassword: string }) {
  return api<{ passwordChanged: true; otherSessionsEnded: number }>('/api/me', { method: 'PATCH', json: input });
}

export function acceptInvitation(token: string) {
  return api<{ seriesId: string }>(`/api/invitations/${token}/accept`, { method: 'POST' });
}
