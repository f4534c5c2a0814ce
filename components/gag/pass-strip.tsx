import Link from 'next/link';
import { BEAT_KINDS, BEAT_LABELS, type BeatKind } from '@/lib/gags/status';
import { NewPassButton } from './new-pass-button';

type PassThumb = { id: string; number: number; seq: number; strokeCount: number; svg: string };

/** All passes side by side, each a server-rendered SVG page with the beat notes under its panels. */
export function PassStrip({
  seriesId,
  gagId,
  passes,
  beats,
  canEdit,
}: {
  seriesId: string;
  gagId: string;
  passes: PassThumb[];
  beats: { kind: BeatKind; note: string }[];
  canEdit: boolean;
}) {
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
          {passes.map((p) => (
            <li key={p.id} className="w-72 shrink-0">
              <Link
                href={`/series/${seriesId}/gags/${gagId}/passes/${p.number}`}
                className="panel block p-2 hover:border-ink"
                aria-label={`Open pass ${p.number} (${p.strokeCount} strokes)`}
              >
                <div className="aspect-square w-full [&>svg]:h-full [&>svg]:w-full" dangerouslySetInnerHTML={{ __html: p.svg }} />
                <p className="mt-1 flex justify-between text-sm">
                  <span className="font-bold">Pass {p.number}</span>
                  <span className="text-graphite-faint">{p.strokeCount} strokes</span>
                </p>
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
          ))}
        </ol>
      )}
    </section>
  );
}
