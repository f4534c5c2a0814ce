'use client';
// A series' scans and photos, shared by the gag page's uploads panel and the editor's lightbox.
import useSWR from 'swr';
import type { UploadListItem } from '@/db/queries/uploads';
import { fetcher } from '@/lib/http/client';

export function useUploads(seriesId: string | null) {
  return useSWR<UploadListItem[]>(seriesId ? `/api/series/${seriesId}/uploads` : null, fetcher);
}
