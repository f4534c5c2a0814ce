'use client';
// The whole book as reader spreads, each page a live thumbnail with its number
// and status, and the warnings the binding and the review loop raise.
import { AlertTriangle } from 'lucide-react';
import type { Flatplan as FlatplanData } from '@/db/queries/volumes';
import { STATUS_LABELS } from '@/lib/gags/status';
import { CONFIRM_WITH_PRINTER } from '@/lib/print/book';
import { MATTER_LABELS } from '@/lib/print/matter';
import { counted } from '@/lib/counted';

export function FlatplanView({ data, binding }: { data: FlatplanData; binding: 'saddle' | 'perfect' }) {
  const byNumber = new Map(data.pages.map((p) => [p.number, p]));
  const page = (n: number | null, side: 'left' | 'right') => {
    if (n === null) return <div className="aspect-square w-24 sm:w-28" aria-hidden />;
    const p = byNumber.get(n)!;
    return (
      <figure
        className={`relative aspect-square w-24 border border-marker-40 bg-white sm:w-28 ${side === 'left' ? 'border-r-graphite' : 'border-l-graphite'}`}
        data-testid="flatplan-page"
      >
        {p.latestPass ? (
          // eslint-disable-next-line @next/next/no-img-element -- private SVG from our own route
          <img src={`/api/passes/${p.latestPass.id}/thumbnail.svg?v=${p.latestPass.seq}`} alt={p.title ?? ''} className="h-full w-full" />
        ) : (
          <div className="flex h-full items-center justify-center p-1 text-center text-xs italic text-graphite-soft">
            {p.kind === 'gag' ? (p.title ?? '') : MATTER_LABELS[p.kind]}
          </div>
        )}
        <figcaption className="absolute bottom-0 left-0 right-0 flex justify-between bg-white/85 px-1 text-[10px]">
          <span className="font-bold">{n}</span>
          {p.status && <span>{STATUS_LABELS[p.status]}</span>}
        </figcaption>
      </figure>
    );
  };
  return (
    <section aria-labelledby="flatplan-title" className="space-y-3">
      <h2 id="flatplan-title" className="text-xl font-extrabold">
        Flatplan
      </h2>
      <div role="list" aria-label="Warnings" className="space-y-1" data-testid="flatplan-warnings">
        {!data.pageCountValid && data.pages.length > 0 && (
          <p role="listitem" className="flex items-start gap-1.5 rounded-md border border-stamp/40 bg-stamp-light px-3 py-2 text-sm text-stamp">
            <AlertTriangle aria-hidden className="mt-0.5 h-4 w-4 shrink-0" />
            {counted(data.pages.length, 'page')} cannot be{' '}
            {binding === 'saddle' ? 'saddle stitched (it takes a multiple of 4)' : 'perfect bound (it takes an even count)'}: add{' '}
            {counted(data.blanksNeeded, 'blank page')}, best after page {data.blanksAt} (after the last gag, before the back matter). Printers differ
            on the counts they take: confirm with your printer.
          </p>
        )}
        {data.notReady.length > 0 && (
          <p role="listitem" className="flex items-start gap-1.5 rounded-md border border-paper-edge bg-white px-3 py-2 text-sm">
            <AlertTriangle aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-stamp" />
            Not yet ready to ink: {data.notReady.map((g) => `${g.title} (${STATUS_LABELS[g.status].toLowerCase()})`).join(', ')}.
          </p>
        )}
      </div>
      <div className="flex flex-wrap gap-4">
        {data.spreads.map(([l, r], i) => (
          <div key={i} className="flex shadow-card" aria-label={`Spread ${i + 1}: ${l ? `page ${l}` : 'nothing'} and ${r ? `page ${r}` : 'nothing'}`}>
            {page(l, 'left')}
            {page(r, 'right')}
          </div>
        ))}
      </div>
      <p className="text-sm text-graphite-soft" data-testid="flatplan-figures">
        {counted(data.pages.length, 'page')} ·{' '}
        {data.spineMm === null ? 'saddle stitched, no spine' : `spine ${data.spineMm.toFixed(2)} mm (pages ÷ 2 × paper caliper)`} ·{' '}
        {binding === 'saddle' ? `${counted(data.sheets, 'sheet')} to fold` : counted(data.sheets, 'leaf', 'leaves')}
        {data.printerSpreads.length > 0 && <> · printer spreads: {data.printerSpreads.map(([a, b]) => `${a}|${b}`).join(', ')}</>}.{' '}
        {CONFIRM_WITH_PRINTER}
      </p>
    </section>
  );
}
