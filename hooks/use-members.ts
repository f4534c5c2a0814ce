'use client';
// Who is in a series, who is invited, and my own settings.
import useSWR from 'swr';
import type { MemberDto } from '@/db/queries/members';
import type { Role } from '@/lib/auth/permissions';
import { fetcher } from '@/lib/http/client';

export type InvitationDto = { id: string; email: string; role: Role; expiresAt: string; invitedBy: string };

export function useMembers(seriesId: string | null) {
  return useSWR<MemberDto[]>(seriesId ? `/api/series/${seriesId}/members` : null, fetcher);
}

/** Pending invitations; owners only (`enabled` false asks nothing). */
export function useInvitations(seriesId: string, enabled: boolean) {
  return useSWR<InvitationDto[]>(enabled ? `/api/series/${seriesId}/invitations` : null, fetcher);
}

export function useMe() {
  return useSWR<{ id: string; name: string; email: string; notifyEmail: boolean }>('/api/me', fetcher);
}
