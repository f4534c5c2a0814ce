'use client';
// SWR hooks for the review loop. Live data follows the page's stream (others'
// comments, stamps and ticks appear as they land); without one it polls every 2 s.
import useSWR from 'swr';
import { useLive, useLivePresence, useLiveSWR } from '@/hooks/use-live';
import type { CommentDto, ThreadDto } from '@/db/queries/comments';
import type { PresenceDto } from '@/db/queries/presence';
import type { ChecklistItemDto } from '@/db/queries/review';
import type { StampDto } from '@/db/queries/stamps';
import type { ActivityDto } from '@/db/queries/activity';
import { api, fetcher } from '@/lib/http/client';
import type { Findings } from '@/lib/review/findings';
import type { Mentions } from '@/lib/review/mentions';
import type { StampDecision } from '@/lib/review/words';

export function useChecklist(passId: string | null) {
  const swr = useLiveSWR<ChecklistItemDto[]>(passId ? `/api/passes/${passId}/checklist` : null, fetcher, { types: ['checklist'], pollMs: 2000 });
  /** Shown at once (a tick clears its item's mark), then as the server answers; undone if it refuses. */
  async function setTicked(ids: string[], recheck?: string[]) {
    const save = api<ChecklistItemDto[]>(`/api/passes/${passId}/checklist`, {
      method: 'PUT',
      json: { ticked: ids, ...(recheck ? { recheck } : {}) },
    });
    await swr.mutate(save, {
      optimisticData: (current) =>
        (current ?? []).map((i) => {
          const ticked = ids.includes(i.id);
          const kept = ticked ? null : recheck && !recheck.includes(i.id) ? null : i.recheck;
          return { ...i, ticked, by: ticked ? i.by : null, at: ticked ? i.at : null, recheck: kept };
        }),
      populateCache: true,
      rollbackOnError: true,
      revalidate: false,
    });
  }
  /** Marks the earlier pass's ticks "to re-check" here. */
  async function carry(from: number) {
    const next = await api<ChecklistItemDto[]>(`/api/passes/${passId}/checklist/carry`, { method: 'POST', json: { from } });
    await swr.mutate(next, { revalidate: false });
  }
  return { ...swr, setTicked, carry };
}

export function useFindings(passId: string | null, seq?: number) {
  return useLiveSWR<Findings>(passId ? `/api/passes/${passId}/findings${seq !== undefined ? `?v=${seq}` : ''}` : null, fetcher, {
    types: ['passes', 'gag'],
    pollMs: 5000,
  });
}

export function useStamps(gagId: string | null) {
  const swr = useLiveSWR<StampDto[]>(gagId ? `/api/gags/${gagId}/stamps` : null, fetcher, { types: ['stamps'], pollMs: 2000 });
  async function stamp(passId: string, decision: StampDecision, note: string) {
    const s = await api<StampDto>(`/api/passes/${passId}/stamp`, { method: 'POST', json: { decision, note } });
    await swr.mutate();
    return s;
  }
  return { ...swr, stamp };
}

export type PostedComment = CommentDto & { mentioned: string[]; mentions: Mentions; notified: { userId: string; name: string }[] };

export function useComments(gagId: string | null) {
  const swr = useLiveSWR<ThreadDto[]>(gagId ? `/api/gags/${gagId}/comments` : null, fetcher, { types: ['comments'], pollMs: 2000 });
  /** Posts; the answer also says what the mentions matched and whom an e-mail went to. */
  async function post(body: Record<string, unknown>) {
    const c = await api<PostedComment>(`/api/gags/${gagId}/comments`, { method: 'POST', json: body });
    await swr.mutate();
    return c;
  }
  async function patch(id: string, body: { body?: string; resolved?: boolean }) {
    await api(`/api/comments/${id}`, { method: 'PATCH', json: body });
    await swr.mutate();
  }
  return { ...swr, post, patch };
}

export type Presence = PresenceDto;

/**
 * Who is on this gag, and where. The page's stream carries it (and keeps this
 * tab's place); without a stream, a heartbeat every 5 s does.
 */
export function usePresence(gagId: string | null, where: string): { data: Presence[] | undefined } {
  const live = useLive();
  const presence = useLivePresence();
  const polled = useSWR<Presence[]>(
    gagId && !live.connected ? [`/api/gags/${gagId}/presence`, where, live.tab] : null,
    ([url]: [string]) => api<Presence[]>(url, { method: 'POST', json: { where, tab: live.tab } }),
    { refreshInterval: 5000, revalidateOnFocus: true },
  );
  return { data: live.connected && presence ? presence : polled.data };
}

/** A page of older activity, before the entry with id `before`. */
export function olderActivity(seriesId: string, before: number) {
  return api<{ items: ActivityDto[]; nextBefore: number | null }>(`/api/series/${seriesId}/activity?limit=15&before=${before}`);
}

export function useActivity(seriesId: string) {
  return useLiveSWR<{ items: ActivityDto[]; nextBefore: number | null }>(`/api/series/${seriesId}/activity?limit=15`, fetcher, {
    types: ['activity'],
    pollMs: 5000,
  });
}
