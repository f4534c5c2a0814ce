'use client';
import { useLiveSWR } from '@/hooks/use-live';
import type { GagDto } from '@/db/queries/gags';
import { api, fetcher } from '@/lib/http/client';
import type { UpdateGagInput } from '@/lib/validation/gag';

export function useGag(gagId: string | null, fallbackData?: GagDto) {
  const { data, error, isLoading, mutate } = useLiveSWR<GagDto>(gagId ? `/api/gags/${gagId}` : null, fetcher, {
    fallbackData,
    // Local edits are the truth while someone types; don't overwrite them on focus.
    // The status can change under us (a stamp, a change that clears it): the stream says when.
    revalidateOnFocus: false,
    types: ['gag', 'stamps'],
    pollMs: 3000,
  });
  async function update(patch: UpdateGagInput) {
    const gag = await api<GagDto>(`/api/gags/${gagId}`, { method: 'PATCH', json: patch });
    await mutate(gag, { revalidate: false });
    return gag;
  }
  async function remove() {
    await api<void>(`/api/gags/${gagId}`, { method: 'DELETE' });
  }
  return { data, error, isLoading, mutate, update, remove };
}
