'use client';
// SWR hooks for the review loop. Live data polls every 2 s (others' comments,
// stamps and ticks appear without a reload).
import useSWR from 'swr';
import type { CommentDto, ThreadDto } from '@/db/queries/comments';
import type { MemberDto } from '@/db/queries/members';
import type { ChecklistItemDto } from '@/db/queries/review';
import type { StampDto } from '@/db/queries/stamps';
import type { ActivityDto } from '@/db/queries/activity';
import { api, fetcher } from '@/lib/http/client';
import type { Findings } from '@/lib/review/findings';

const LIVE = { refreshInterval: 2000 };

export function useChecklist(passId: string | null) {
  const swr = useSWR<ChecklistItemDto[]>(passId ? `/api/passes/${passId}/checklist` : null, fetcher, LIVE);
  async function setTicked(ids: string[]) {
    const next = await api<ChecklistItemDto[]>(`/api/passes/${passId}/checklist`, { method: 'PUT', json: { ticked: ids } });
    await swr.mutate(next, { revalidate: false });
  }
  return { ...swr, setTicked };
}

export function useFindings(passId: string | null, seq?: number) {
  return useSWR<Findings>(passId ? `/api/passes/${passId}/findings${seq !== undefined ? `?v=${seq}` : ''}` : null, fetcher, { refreshInterval: 5000 });
}

export function useStamps(gagId: string | null) {
  const swr = useSWR<StampDto[]>(gagId ? `/api/gags/${gagId}/stamps` : null, fetcher, LIVE);
  async function stamp(passId: string, decision: 'ready' | 'again', note: string) {
    const s = await api<StampDto>(`/api/passes/${passId}/stamp`, { method: 'POST', json: { decision, note } });
    await swr.mutate();
    return s;
  }
  return { ...swr, stamp };
}

export function useComments(gagId: string | null) {
  const swr = useSWR<ThreadDto[]>(gagId ? `/api/gags/${gagId}/comments` : null, fetcher, LIVE);
  async function post(body: Record<string, unknown>) {
    const c = await api<CommentDto>(`/api/gags/${gagId}/comments`, { method: 'POST', json: body });
    await swr.mutate();
    return c;
  }
  async function patch(id: string, body: { body?: string; resolved?: boolean }) {
    await api(`/api/comments/${id}`, { method: 'PATCH', json: body });
    await swr.mutate();
  }
  return { ...swr, post, patch };
}

export type Presence = { userId: string; name: string; scope: string; seenAt: string };

/** Sends a heartbeat every 5 s and returns who else is on this gag. */
export function usePresence(gagId: string | null, where: string) {
  return useSWR<Presence[]>(
    gagId ? [`/api/gags/${gagId}/presence`, where] : null,
    ([url]: [string]) => api<Presence[]>(url, { method: 'POST', json: { where } }),
    { refreshInterval: 5000, revalidateOnFocus: true },
  );
}

export function useMembers(seriesId: string | null) {
  return useSWR<MemberDto[]>(seriesId ? `/api/series/${seriesId}/members` : null, fetcher);
}

export function useActivity(seriesId: string) {
  return useSWR<{ items: ActivityDto[]; nextBefore: number | null }>(`/api/series/${seriesId}/activity?limit=15`, fetcher, { refreshInterval: 5000 });
}
