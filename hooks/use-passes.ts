'use client';
// A gag's passes and a pass's revisions, kept fresh by the page's live stream.
import type { PassSummary } from '@/db/queries/passes';
import type { RevisionDto } from '@/db/queries/revisions';
import { useLiveSWR } from '@/hooks/use-live';
import { api, fetcher } from '@/lib/http/client';

export function usePasses(gagId: string, fallbackData?: PassSummary[]) {
  return useLiveSWR<PassSummary[]>(`/api/gags/${gagId}/passes`, fetcher, { fallbackData, types: ['passes'], pollMs: 2000 });
}

/** Starts a pass of a gag: blank, or a copy of pass `copyFrom`. */
export function startPass(gagId: string, copyFrom?: number) {
  return api<{ id: string; number: number }>(`/api/gags/${gagId}/passes`, { method: 'POST', json: copyFrom ? { copyFrom } : {} });
}

export function useRevisions(passId: string) {
  const swr = useLiveSWR<RevisionDto[]>(`/api/passes/${passId}/revisions`, fetcher, { types: ['seq'], pollMs: 5000 });
  async function restore(revisionId: string) {
    await api(`/api/passes/${passId}/revisions/${revisionId}/restore`, { method: 'POST' });
    await swr.mutate();
  }
  return { ...swr, restore };
}
