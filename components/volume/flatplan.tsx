'use client';
// The whole book as the reader will see it: each page its final page, trimmed and placed by
// its fit, or else its newest pass marked "not final"; in reader spreads or in the printer's
// (the pairs a saddle-stitched sheet carries), each page with its preflight level beside it,
// and the warnings the binding and the review loop raise.
import { AlertTriangle } from 'lucide-react';
import { useState } from 'react';
import { LEVEL_WORDS, LevelMark } from '@/components/final/checks-list';
import { FittedPage } from '@/components/final/fitted-page';
import type { Flatplan as FlatplanData } from '@/db/queries/volumes';
import { STATUS_LABELS } from '@/lib/gags/status';
import { CONFIRM_WITH_PRINTER, type Spread, type VolumeSpec } from '@/lib/print/book';
import { MATTER_LABELS } from '@/lib/print/matter';
import type { PagePreflight } from '@/lib/print/preflight';
import { counted } from '@/lib/counted';
import { usePreflight } from './preflight-view';

type Page = FlatplanData['pages'][number];
type View = 'reader' | 'printer';

/** The preflight's rule names in a few words, for the mark under a page (the list below has the full messages). */
const RULE_WORDS: Record<string, string> = {
  missing: 'no final page',
  resolution: 'resolution',
  colour: 'colour',
  bleed: 'bleed',
  'cut-band': 'may be cut',
};

const PAGE_W = 'w-24 sm:w-28';

function PageFace({ p, spec }: { p: Page; spec: VolumeSpec }) {
  const name = p.kind === 'gag' ? (p.title ?? '') : MATTER_LABELS[p.kind];
  if (p.final) {
    return (
      <FittedPage
        spec={spec}
        scan={{ width: p.final.width, height: p.final.height }}
        fit={p.final.fit}
        imageUrl={`/api/final-pages/${p.final.id}/image/preview?v=${p.final.version}`}
        label={`Page ${p.number}, ${name}: final page`}
      />
    );
  }
  return (
    <>
      {p.latestPass ? (
        // eslint-disable-next-line @next/next/no-img-element -- private SVG from our own route
        <img
          src={`/api/passes/${p.latestPass.id}/thumbnail.svg?v=${p.latestPass.seq}`}
          alt={`Page ${p.number}, ${name}: newest pass, not final`}
          className="h-full w-full"
        />
      ) : (
        <div className="flex h-full items-center justify-center p-1 text-center text-xs italic text-graphite-soft">{name}</div>
      )}
      <span className="absolute left-0 top-0 bg-paper-deep px-1 text-[10px] font-bold text-graphite" data-testid="flatplan-not-final">
        not final
      </span>
    </>
  );
}

function PreflightMark({ pf }: { pf: PagePreflight | undefined }) {
  if (!pf) return <p className={`${PAGE_W} h-4`} aria-hidden />;
  const flagged = pf.checks.filter((c) => c.level !== 'ok');
  const rules = [...new Set(flagged.map((c) => RULE_WORDS[c.rule] ?? c.rule))].join(', ');
  return (
    <p
      className={`${PAGE_W} flex items-center gap-1 truncate text-[11px] leading-4`}
      title={flagged.length ? flagged.map((c) => c.message).join('\n') : 'Every check passes.'}
      data-testid="flatplan-preflight"
      data-level={pf.level}
    >
      <LevelMark level={pf.level} className="h-3 w-3" />
      <span className="truncate">
        <span className="font-bold">{LEVEL_WORDS[pf.level]}</span>
        {rules && `: ${rules}`}
      </span>
    </p>
  );
}

export function FlatplanView({ data, spec, volumeId }: { data: FlatplanData; spec: VolumeSpec; volumeId: string }) {
  const [view, setView] = useState<View>('reader');
  const binding = spec.binding;
  const preflight = usePreflight(volumeId).data;
  const byNumber = new Map(data.pages.map((p) => [p.number, p]));
  const checksOf = new Map((preflight?.pages ?? []).map((p) => [p.entryId, p]));
  const face = (n: number | null, side: 'left' | 'right') => {
    const ratio = { aspectRatio: `${spec.trimW} / ${spec.trimH}` };
    if (n === null) return <div className={PAGE_W} style={ratio} aria-hidden />;
    const p = byNumber.get(n)!;
    return (
      <figure
        className={`relative overflow-hidden border border-marker-40 bg-white ${PAGE_W} ${side === 'left' ? 'border-r-graphite' : 'border-l-graphite'}`}
        style={ratio}
        data-testid="flatplan-page"
        data-final={p.final ? 'yes' : 'no'}
      >
        <PageFace p={p} spec={spec} />
        <figcaption className="absolute bottom-0 left-0 right-0 flex justify-between bg-white/85 px-1 text-[10px]">
          <span className="font-bold">{n}</span>
          {p.status && <span>{STATUS_LABELS[p.status]}</span>}
        </figcaption>
      </figure>
    );
  };
  const mark = (n: number | null) =>
    n === null ? <p className={PAGE_W} aria-hidden /> : <PreflightMark pf={checksOf.get(byNumber.get(n)!.entryId)} />;
  const spread = ([l, r]: Spread, label: string, key: number) => (
    <div key={key} role="group" aria-label={label} className="space-y-1" data-testid={`${view}-spread`}>
      <div className="flex shadow-card">
        {face(l, 'left')}
        {face(r, 'right')}
      </div>
      <div className="flex">
        {mark(l)}
        {mark(r)}
      </div>
    </div>
  );
  const pair = (l: number | null, r: number | null) => `${l ? `page ${l}` : 'nothing'} and ${r ? `page ${r}` : 'nothing'}`;
  return (
    <section aria-labelledby="flatplan-title" className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="flatplan-title" className="text-xl font-extrabold">
          Flatplan
        </h2>
        <div role="group" aria-label="Show the pages as" className="inline-flex rounded-md border border-paper-edge bg-white p-0.5">
          {(['reader', 'printer'] as const).map((v) => (
            <button
              key={v}
              type="button"
              aria-pressed={view === v}
              onClick={() => setView(v)}
              className={`rounded px-3 py-1 text-sm font-bold ${view === v ? 'bg-ink text-white' : 'text-graphite-soft hover:bg-paper-deep'}`}
            >
              {v === 'reader' ? 'Reader spreads' : 'Printer spreads'}
            </button>
          ))}
        </div>
      </div>
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
      {view === 'reader' ? (
        <div className="flex flex-wrap gap-4">{data.spreads.map(([l, r], i) => spread([l, r], `Spread ${i + 1}: ${pair(l, r)}`, i))}</div>
      ) : binding === 'perfect' ? (
        <p className="rounded-md border border-paper-edge bg-white px-3 py-2 text-sm" data-testid="printer-spreads-note">
          A perfect-bound book has no printer spreads to show here: its leaves are glued at the spine, and the printer imposes the pages on press
          sheets of their own choosing. What you send is the pages in reading order, as the reader spreads show them. {CONFIRM_WITH_PRINTER}
        </p>
      ) : data.printerSpreads.length === 0 ? (
        <p className="rounded-md border border-paper-edge bg-white px-3 py-2 text-sm" data-testid="printer-spreads-note">
          Saddle stitching folds sheets of four pages, so the printer&rsquo;s spreads need a page count that is a multiple of 4: add{' '}
          {counted(data.blanksNeeded, 'blank page')} first (see the warning above). {CONFIRM_WITH_PRINTER}
        </p>
      ) : (
        <>
          <p className="text-sm text-graphite-soft">
            Each printer spread is one side of a sheet as it goes through the press. The sheets are folded in half and nested, so the two pages on one
            side add up to {data.pages.length + 1}; only the inside of the middle sheet is a reader spread too.
          </p>
          <div className="flex flex-wrap gap-4">
            {data.printerSpreads.map(([l, r], i) =>
              spread([l, r], `Sheet ${Math.floor(i / 2) + 1}, ${i % 2 === 0 ? 'outside' : 'inside'}: ${pair(l, r)}`, i),
            )}
          </div>
        </>
      )}
      <p className="text-sm text-graphite-soft" data-testid="flatplan-figures">
        {counted(data.pages.length, 'page')} ·{' '}
        {data.spineMm === null ? 'saddle stitched, no spine' : `spine ${data.spineMm.toFixed(2)} mm (pages ÷ 2 × paper caliper)`} ·{' '}
        {binding === 'saddle' ? `${counted(data.sheets, 'sheet')} to fold` : counted(data.sheets, 'leaf', 'leaves')}
        {data.printerSpreads.length > 0 && <> · printer spreads: {data.printerSpreads.map(([a, b]) => `${a}|${b}`).join(', ')}</>}.{' '}
        {CONFIRM_WITH_PRINTER}
      </p>
      <p className="text-xs text-graphite-faint">
        Each page shows its final page trimmed and placed as fitted, or its newest pass marked &ldquo;not final&rdquo;. Under it, its preflight level
        (the checks in full are in the preflight below).
      </p>
    </section>
  );
}
