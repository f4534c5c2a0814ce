'use client';
// The series' default page: trim, bleed, safe margin, gutter (mm). Owners edit it;
// everyone else sees it. The summary is part of the page; the fields (and the form
// code) load when someone opens it.
import dynamic from 'next/dynamic';
import { useState } from 'react';
import { type PageSpec, panelRects } from '@/lib/print/geometry';

const PageSpecFields = dynamic(() => import('./page-spec-fields').then((m) => m.PageSpecFields), {
  ssr: false,
  loading: () => (
    <p role="status" className="mt-3 text-sm text-graphite-faint">
      Opening the page setup…
    </p>
  ),
});

export function PageSpecForm({ seriesId, initial, canEdit }: { seriesId: string; initial: PageSpec; canEdit: boolean }) {
  const [saved, setSaved] = useState<PageSpec>(initial);
  const [opened, setOpened] = useState(false);
  const panel = panelRects(saved)[0]!;
  return (
    <details className="panel p-4" onToggle={(e) => e.currentTarget.open && setOpened(true)}>
      <summary className="cursor-pointer font-bold">
        Page setup: {saved.trimW} × {saved.trimH} mm, bleed {saved.bleed} mm, panels {panel.w.toFixed(1)} × {panel.h.toFixed(1)} mm
      </summary>
      {opened && <PageSpecFields seriesId={seriesId} initial={saved} canEdit={canEdit} onSaved={setSaved} />}
    </details>
  );
}
