'use client';
// A series' scans and photos, shared by the gag page's uploads panel and the editor's lightbox.
import useSWR from 'swr';
import type { UploadListItem } from '@/db/queries/uploads';
import { api, fetcher } from '@/lib/http/client';

export function useUploads(seriesId: string | null) {
  const swr = useSWR<UploadListItem[]>(seriesId ? `/api/series/${seriesId}/uploads` : null, fetcher);
  /** Deletes an upload; `confirmed` when passes still place it (they then show an empty frame). */
  async function remove(uploadId: string, confirmed: boolean) {
    await api(`/api/uploads/${uploadId}${confirmed ? '?confirm=1' : ''}`, { method: 'DELETE' });
    await swr.mutate();
  }
  return { ...swr, remove };
}
