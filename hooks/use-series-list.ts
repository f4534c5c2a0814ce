'use client';
import useSWR from 'swr';
import type { SeriesDto } from '@/db/queries/series';
import { api, fetcher } from '@/lib/http/client';

export function useSeriesList(fallbackData?: SeriesDto[]) {
  const { data, error, isLoading, mutate } = useSWR<SeriesDto[]>('/api/series', fetcher, { fallbackData });
  async function createSeries(title: string) {
    const created = await api<SeriesDto>('/api/series', { method: 'POST', json: { title } });
    await mutate();
    return created;
  }
  return { data, error, isLoading, mutate, createSeries };
}
