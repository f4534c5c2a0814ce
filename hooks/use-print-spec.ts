'use client';
// The series' page spec (trim, bleed, safe area, gutter), as the owner sets it.
import { api } from '@/lib/http/client';
import type { PageSpec } from '@/lib/print/geometry';

export function savePrintSpec(seriesId: string, spec: PageSpec) {
  return api<PageSpec>(`/api/series/${seriesId}/print-spec`, { method: 'PUT', json: spec });
}
