'use client';
// The series' silent-read checklist items, as the owner words them.
import useSWR from 'swr';
import { api, fetcher } from '@/lib/http/client';

export type ChecklistItem = { id: string; text: string };

export function useSeriesChecklist(seriesId: string) {
  const swr = useSWR<ChecklistItem[]>(`/api/series/${seriesId}/checklist`, fetcher);
  async function save(items: { id?: string; text: string }[]) {
    const next = await api<ChecklistItem[]>(`/api/series/${seriesId}/checklist`, { method: 'PUT', json: { items } });
    await swr.mutate(next, { revalidate: false });
    return next;
  }
  return { ...swr, save };
}
