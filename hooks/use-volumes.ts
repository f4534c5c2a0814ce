'use client';
// Volumes: a series' list, and one volume with its flatplan and plan kept in step.
// On the volume page the series' stream says when a gag's status moved (a stamp, a
// clearing, a move on the board): the badges, the flatplan's warnings and the plan follow;
// and when a final page was uploaded, fitted or made current ('final'), the flatplan redraws it.
import useSWR from 'swr';
import { useLiveSWR } from '@/hooks/use-live';
import type { EntryDto, Flatplan, VolumeDto } from '@/db/queries/volumes';
import type { GagStatus } from '@/lib/gags/status';
import { api, fetcher } from '@/lib/http/client';
import type { PlanData } from '@/components/volume/planner';

export type VolumeData = VolumeDto & { entries: EntryDto[]; unplaced: { id: string; title: string; status: GagStatus }[] };

export function useVolumes(seriesId: string | null) {
  const swr = useSWR<VolumeDto[]>(seriesId ? `/api/series/${seriesId}/volumes` : null, fetcher);
  async function create(input: { title: string; deadline: string }) {
    const v = await api<VolumeDto>(`/api/series/${seriesId}/volumes`, { method: 'POST', json: input });
    await swr.mutate();
    return v;
  }
  return { ...swr, create };
}

/** Changes to a volume's running order. */
export function runningOrderActions(volumeId: string) {
  const base = `/api/volumes/${volumeId}/entries`;
  return {
    addGag: (gagId: string) => api<EntryDto>(base, { method: 'POST', json: { gagId } }),
    addMatter: (kind: string) => api<EntryDto>(base, { method: 'POST', json: { kind } }),
    remove: (entryId: string) => api(`${base}/${entryId}`, { method: 'DELETE' }),
    setDone: (entryId: string, done: boolean) => api(`${base}/${entryId}`, { method: 'PATCH', json: { done } }),
    move: (entryId: string, to: { before: string } | { after: string }) => api(`${base}/${entryId}/position`, { method: 'PUT', json: to }),
  };
}

export function useVolume(initial: VolumeData) {
  // Without a stream these wait for the next change here, as before (pollMs 0).
  const live = { types: ['gags'], pollMs: 0 };
  const vol = useLiveSWR<VolumeData>(`/api/volumes/${initial.id}`, fetcher, { fallbackData: initial, ...live });
  const flat = useLiveSWR<Flatplan>(`/api/volumes/${initial.id}/flatplan`, fetcher, { ...live, types: ['gags', 'final'] });
  const plan = useLiveSWR<PlanData>(`/api/volumes/${initial.id}/plan`, fetcher, live);
  const volume = vol.data ?? initial;
  const reloadAll = () => Promise.all([vol.mutate(), flat.mutate(), plan.mutate()]);
  /** After a running-order change: the new entries at once, or everything read again. */
  async function refresh(next?: EntryDto[]) {
    if (next) await vol.mutate({ ...volume, entries: next }, { revalidate: false });
    else await reloadAll();
  }
  async function patch(body: Record<string, unknown>) {
    await api(`/api/volumes/${volume.id}`, { method: 'PATCH', json: body });
    await reloadAll();
  }
  return { volume, flatplan: flat.data, plan: plan.data, refresh, patch };
}
