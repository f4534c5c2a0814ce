'use client';
// A gag's or a matter page's final pages (newest first, the current one marked), kept
// fresh by the page's stream, with the changes a person makes to them.
import type { FinalPageDto } from '@/db/queries/final-pages';
import { useLiveSWR } from '@/hooks/use-live';
import { api, fetcher } from '@/lib/http/client';
import type { FitInput } from '@/lib/validation/final-page';

export function useFinalPages(listUrl: string | null) {
  const swr = useLiveSWR<FinalPageDto[]>(listUrl, fetcher, { types: ['final'], pollMs: 10_000 });
  async function fit(id: string, input: FitInput) {
    const page = await api<FinalPageDto>(`/api/final-pages/${id}/fit`, { method: 'PUT', json: input });
    await swr.mutate();
    return page;
  }
  async function makeCurrent(id: string) {
    await api<FinalPageDto>(`/api/final-pages/${id}/current`, { method: 'POST' });
    await swr.mutate();
  }
  const current = swr.data?.find((p) => p.current) ?? null;
  return { ...swr, current, fit, makeCurrent };
}
