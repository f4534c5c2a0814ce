'use client';
// All passes side by side, each an SVG page rendered on the server (the same
// geometry as the editor), with the beat notes under its panels and the mark of its
// newest stamp (approved, sent back, or cleared). The list and the marks follow the
// page's stream, so strokes and stamps show up here without a reload.
import Link from 'next/link';
import { StampMark } from '@/components/ui/stamp-mark';
import { usePasses } from '@/hooks/use-passes';
import { useStamps } from '@/hooks/use-review';
import type { PassSummary } from '@/db/queries/passes';
import { BEAT_KINDS, BEAT_LABELS, type BeatKind } from '@/lib/gags/status';
import { NewPassButton } from './new-pass-button';
import { counted } from '@/lib/counted';

export function PassStrip({
  seriesId,
  gagId,
  passes: initial,
  beats,
  canEdit,
}: {
  seriesId: string;
  gagId: string;
  passes: PassSummary[];
  beats: { kind: BeatKind; note: string }[];
  canEdit: boolean;
}) {
  const { data } = usePasses(gagId, initial);
  const passes = data ?? initial;
  // Newest first: the first stamp naming a pass is the one its card shows.
  const { data: stamps } = useStamps(gagId);
  const stampOf = (passId: string) => stamps?.find((s) => s.passId === passId);
  const notes = Object.fromEntries(beats.map((b) => [b.kind, b.note])) as Record<BeatKind, string>;
  return (
    <section aria-labelledby="passes-title" className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="passes-title" className="text-xl font-extrabold">
          Passes
        </h2>
        {canEdit && <NewPassButton seriesId={seriesId} gagId={gagId} passNumbers={passes.map((p) => p.number)} />}
      </div>
      {passes.length === 0 ? (
        <p className="text-graphite-soft">No thumbnail pass yet.{canEdit ? ' Start one to sketch the four beats.' : ''}</p>
      ) : (
        <ol className="flex gap-4 overflow-x-auto pb-2">
          {passes.map((p) => {
            const stamp = stampOf(p.id);
            return (
              <li key={p.id} className="w-72 shrink-0" data-testid={`pass-card-${p.number}`}>
                <Link href={`/series/${seriesId}/gags/${gagId}/passes/${p.number}`} className="panel relative block p-2 hover:border-ink">
                  {/* eslint-disable-next-line @next/next/no-img-element -- a private SVG from our own route, versioned by seq */}
                  <img
                    src={`/api/passes/${p.id}/thumbnail.svg?v=${p.seq}`}
                    alt=""
                    width={272}
                    height={272}
                    className="aspect-square w-full bg-white"
                  />
                  <p className="mt-1 flex justify-between text-sm">
                    <span className="font-bold">Open pass {p.number}</span>
                    <span className="text-graphite-faint" data-testid={`pass-${p.number}-strokes`}>
                      {counted(p.strokeCount, 'stroke')}
                    </span>
                  </p>
                  {stamp && (
                    <StampMark
                      decision={stamp.decision}
                      standing={stamp.decision === 'ready' && !stamp.clearedAt}
                      className={stamp.decision === 'ready' && !stamp.clearedAt ? 'absolute right-3 top-3 shadow-card' : 'mt-0.5'}
                    />
                  )}
                </Link>
                <dl className="mt-1 grid grid-cols-2 gap-x-2 gap-y-1 text-xs">
                  {BEAT_KINDS.map((k, i) => (
                    <div key={k}>
                      <dt className="font-bold">
                        {i + 1} {BEAT_LABELS[k]}
                      </dt>
                      <dd className="line-clamp-2 text-graphite-soft">{notes[k] || '—'}</dd>
                    </div>
                  ))}
                </dl>
              </li>
            );
          })}
        </ol>
      )}
    </section>
  );
}
