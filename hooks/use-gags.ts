'use client';
import { useLiveSWR } from '@/hooks/use-live';
import type { GagDto } from '@/db/queries/gags';
import { api, fetcher } from '@/lib/http/client';
import type { CreateGagInput } from '@/lib/validation/gag';
import type { GagStatus } from '@/lib/gags/status';

export function useGags(seriesId: string | null, fallbackData?: GagDto[]) {
  // Others' new gags, moves and status changes arrive through the board's stream.
  const { data, error, isLoading, mutate } = useLiveSWR<GagDto[]>(seriesId ? `/api/series/${seriesId}/gags` : null, fetcher, {
    fallbackData,
    types: ['gags'],
    pollMs: 10_000,
  });
  async function createGag(input: CreateGagInput) {
    const gag = await api<GagDto>(`/api/series/${seriesId}/gags`, { method: 'POST', json: input });
    // The board's stream may have brought the new gag in already.
    await mutate((list) => [...(list ?? []).filter((g) => g.id !== gag.id), gag], { revalidate: false });
    return gag;
  }
  /**
   * Moves a gag to another status by hand (the board's columns and menus): the card shows in
   * its new column at once and goes back if the server refuses the move.
   */
  async function setStatus(gagId: string, status: GagStatus) {
    let updated: GagDto | undefined;
    await mutate(
      async (list) => {
        updated = await api<GagDto>(`/api/gags/${gagId}`, { method: 'PATCH', json: { status } });
        return list?.map((g) => (g.id === updated!.id ? updated! : g));
      },
      {
        optimisticData: (list) => (list ?? []).map((g) => (g.id === gagId ? { ...g, status } : g)),
        rollbackOnError: true,
        revalidate: false,
      },
    );
    return updated!;
  }
  return { data, error, isLoading, mutate, createGag, setStatus };
}
