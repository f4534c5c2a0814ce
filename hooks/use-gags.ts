'use client';
import useSWR from 'swr';
import type { GagDto } from '@/db/queries/gags';
import { api, fetcher } from '@/lib/http/client';
import type { CreateGagInput } from '@/lib/validation/gag';

export function useGags(seriesId: string | null, fallbackData?: GagDto[]) {
  const { data, error, isLoading, mutate } = useSWR<GagDto[]>(
    seriesId ? `/api/series/${seriesId}/gags` : null,
    fetcher,
    { fallbackData },
  );
  async function createGag(input: CreateGagInput) {
    const gag = await api<GagDto>(`/api/series/${seriesId}/gags`, { method: 'POST', json: input });
    await mutate((list) => [...(list ?? []), gag], { revalidate: false });
    return gag;
  }
  return { data, error, isLoading, mutate, createGag };
}
