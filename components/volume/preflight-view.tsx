'use client';
// The volume's preflight: the book's checks, then every page in running order with its
// worst level in words and its checks, as the server computed them.
import { ChecksList, LEVEL_WORDS, LevelMark } from '@/components/final/checks-list';
import type { EntryDto } from '@/db/queries/volumes';
import { useLiveSWR } from '@/hooks/use-live';
import type { VolumePreflight } from '@/lib/export/volume-preflight';
import { fetcher } from '@/lib/http/client';
import { entryLabel } from '@/lib/print/matter';

/**
 * One fetch for the volume, shared by this list and the flatplan's marks (one SWR key): read
 * again when the series' stream says a gag moved or a final page changed, every 30 s without it.
 */
export function usePreflight(volumeId: string) {
  return useLiveSWR<VolumePreflight>(`/api/volumes/${volumeId}/preflight`, fetcher, { types: ['gags', 'final'], pollMs: 30_000 });
}

export function PreflightView({ volumeId, entries }: { volumeId: string; entries: EntryDto[] }) {
  const { data, error, isLoading } = usePreflight(volumeId);
  const label = (entryId: string) => {
    const e = entries.find((x) => x.id === entryId);
    return e ? entryLabel(e) : '';
  };
  return (
    <section aria-labelledby="preflight-title" className="space-y-3" data-testid="volume-preflight">
      <h2 id="preflight-title" className="text-xl font-extrabold">
        Preflight
      </h2>
      {!data ? (
        <p className="text-sm text-graphite-faint">
          {error ? 'The preflight could not be read.' : isLoading ? 'Checking every page (scans are measured once)…' : ''}
        </p>
      ) : (
        <>
          <div className="rounded-md border border-paper-edge bg-white p-3">
            <p className="mb-1 flex items-center gap-1.5 font-bold" data-testid="book-level">
              <LevelMark level={data.book.level} /> The book: {LEVEL_WORDS[data.book.level]}
            </p>
            <ChecksList checks={data.book.checks} label="Preflight of the book" />
          </div>
          <ol className="space-y-1" aria-label="Preflight page by page">
            {data.pages.map((p) => (
              <li key={p.entryId} data-testid="preflight-page" data-level={p.level}>
                <details>
                  <summary className="flex cursor-pointer items-center gap-1.5 text-sm">
                    <LevelMark level={p.level} />
                    <span className="w-8 font-bold">{p.number}</span>
                    <span className="flex-1">{label(p.entryId)}</span>
                    <span className="text-graphite-soft">
                      {LEVEL_WORDS[p.level]}
                      {p.ppi && ` · ${Math.round(Math.min(p.ppi.x, p.ppi.y))} ppi`}
                    </span>
                  </summary>
                  <div className="ml-6 mt-1">
                    <ChecksList checks={p.checks} label={`Preflight of page ${p.number}`} />
                  </div>
                </details>
              </li>
            ))}
          </ol>
          <p className="text-xs text-graphite-faint">{data.note}</p>
        </>
      )}
    </section>
  );
}
