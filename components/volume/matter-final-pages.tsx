'use client';
// The final pages of the volume's matter pages (cover, title page, afterword…): each one's
// scan uploaded, fitted and kept with its history here, as a gag's is on the gag page.
// A blank page needs none. Each opens on demand, so the volume page loads no scans it does not show.
import { useState } from 'react';
import { FinalPagePanel } from '@/components/final/final-page-panel';
import type { EntryDto } from '@/db/queries/volumes';
import type { PageSpec } from '@/lib/print/geometry';
import { entryLabel } from '@/lib/print/matter';

export function MatterFinalPages({ volumeId, entries, spec, canEdit }: { volumeId: string; entries: EntryDto[]; spec: PageSpec; canEdit: boolean }) {
  const matter = entries.map((e, i) => ({ e, number: i + 1 })).filter(({ e }) => e.kind !== 'gag' && e.kind !== 'blank');
  if (!matter.length) return null;
  return (
    <section aria-labelledby="matter-finals-title" className="space-y-2" data-testid="matter-final-pages">
      <h2 id="matter-finals-title" className="text-xl font-extrabold">
        Matter pages&apos; final pages
      </h2>
      <p className="text-sm text-graphite-soft">
        A gag&apos;s final page is on its own page; the cover, title page and other matter pages have theirs here.
      </p>
      {matter.map(({ e, number }) => (
        <MatterPage key={e.id} volumeId={volumeId} entry={e} number={number} spec={spec} canEdit={canEdit} />
      ))}
    </section>
  );
}

function MatterPage({
  volumeId,
  entry,
  number,
  spec,
  canEdit,
}: {
  volumeId: string;
  entry: EntryDto;
  number: number;
  spec: PageSpec;
  canEdit: boolean;
}) {
  const [open, setOpen] = useState(false);
  return (
    <details className="rounded-md border border-paper-edge bg-white px-3 py-2" onToggle={(ev) => setOpen(ev.currentTarget.open)}>
      <summary className="cursor-pointer text-sm font-bold">
        Page {number}: {entryLabel(entry)}
      </summary>
      {open && (
        <div className="pt-3">
          <FinalPagePanel
            title={`${entryLabel(entry)} — final page`}
            listUrl={`/api/volumes/${volumeId}/entries/${entry.id}/final-pages`}
            spec={spec}
            canEdit={canEdit}
            headingLevel={3}
          />
        </div>
      )}
    </details>
  );
}
