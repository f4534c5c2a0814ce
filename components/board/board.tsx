'use client';
// The board of one series: gags grouped by status (columns) or as a sortable
// table, with a shared search and status filter.
import dynamic from 'next/dynamic';
import Link from 'next/link';
import { useCallback, useMemo, useState } from 'react';
import { BeatGridMark } from '@/components/ui/beat-grid-mark';
import { LoupeGlyph, PanelsGlyph, RowsGlyph } from '@/components/ui/board-glyphs';
import { StampMark } from '@/components/ui/stamp-mark';
import { StatusBadge } from '@/components/ui/status-badge';
import { When } from '@/components/ui/when';
import type { GagDto } from '@/db/queries/gags';
import { useGags } from '@/hooks/use-gags';
import { ROLE_LABELS, type Role, can } from '@/lib/auth/permissions';
import { filterGags } from '@/lib/gags/filter';
import { GAG_STATUSES, type GagStatus, STATUS_LABELS } from '@/lib/gags/status';
import { messageOf } from '@/lib/http/client';

type View = 'board' | 'table';

// The new-gag form (and its form library) loads after the board is shown; the sortable
// table (and its table library) only when someone switches to it.
const NewGagForm = dynamic(() => import('./new-gag-form').then((m) => m.NewGagForm), {
  ssr: false,
  loading: () => <div className="panel h-[5.5rem]" aria-hidden="true" />,
});
const GagTable = dynamic(() => import('./gag-table').then((m) => m.GagTable), {
  ssr: false,
  loading: () => (
    <p role="status" className="py-8 text-center text-graphite-faint">
      Setting out the table…
    </p>
  ),
});

export function Board({ seriesId, seriesTitle, role, initialGags }: { seriesId: string; seriesTitle: string; role: Role; initialGags: GagDto[] }) {
  const { data, createGag, setStatus: moveGag } = useGags(seriesId, initialGags);
  const [view, setView] = useState<View>('board');
  const [query, setQuery] = useState('');
  const [status, setStatus] = useState<GagStatus | 'all'>('all');
  const [notice, setNotice] = useState<string | null>(null);
  const canEdit = can(role, 'edit');
  const gags = useMemo(() => filterGags(data ?? [], query, status), [data, query, status]);

  const onStatus = useCallback(
    async (gag: GagDto, next: GagStatus) => {
      setNotice(null);
      try {
        const updated = await moveGag(gag.id, next);
        setNotice(`“${updated.title}” is now ${STATUS_LABELS[updated.status]}.`);
      } catch (err) {
        setNotice(messageOf(err, 'Could not change the status.'));
      }
    },
    [moveGag],
  );

  const columns = status === 'all' ? GAG_STATUSES : [status];

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="text-sm text-graphite-faint">
            <Link href="/series" className="hover:underline">
              My series
            </Link>{' '}
            / board
          </p>
          <h1 className="text-3xl font-extrabold">{seriesTitle}</h1>
          <p className="text-sm text-graphite-soft">
            Your role: <strong data-testid="my-role">{ROLE_LABELS[role]}</strong>
            {!canEdit && ' — you can read the board; editing is for co-creators and owners.'}{' '}
            <Link href={`/series/${seriesId}/members`} className="font-bold text-ink hover:underline">
              Members
            </Link>
          </p>
        </div>
        <div role="group" aria-label="View" className="inline-flex rounded-md border border-paper-edge bg-white p-0.5">
          {(
            [
              ['board', 'Board', PanelsGlyph],
              ['table', 'Table', RowsGlyph],
            ] as const
          ).map(([v, label, Icon]) => (
            <button
              key={v}
              type="button"
              aria-pressed={view === v}
              onClick={() => setView(v)}
              className={`inline-flex items-center gap-1.5 rounded px-3 py-1.5 text-sm font-bold ${view === v ? 'bg-ink text-white' : 'text-graphite-soft hover:bg-paper-deep'}`}
            >
              <Icon className="h-4 w-4" /> {label}
            </button>
          ))}
        </div>
      </div>

      {canEdit && <NewGagForm onCreate={createGag} />}

      <div className="flex flex-wrap items-end gap-3">
        <div className="relative min-w-[14rem] flex-1">
          <label htmlFor="gag-search" className="mb-1 block text-sm font-bold text-graphite-soft">
            Search title and premise
          </label>
          <LoupeGlyph className="pointer-events-none absolute bottom-2.5 left-2.5 h-4 w-4 text-graphite-faint" />
          <input
            id="gag-search"
            type="search"
            value={query}
            onChange={(e) => setQuery(e.target.value)}
            className="field pl-8"
            placeholder="teapot, gull, rain…"
          />
        </div>
        <div>
          <label htmlFor="status-filter" className="mb-1 block text-sm font-bold text-graphite-soft">
            Status
          </label>
          <select id="status-filter" value={status} onChange={(e) => setStatus(e.target.value as GagStatus | 'all')} className="field w-auto">
            <option value="all">All statuses</option>
            {GAG_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABELS[s]}
              </option>
            ))}
          </select>
        </div>
        <p className="pb-2 text-sm text-graphite-faint" aria-live="polite">
          {gags.length} of {data?.length ?? 0} gags
        </p>
      </div>
      {notice && (
        <p role="status" className="rounded-md bg-ink-light px-3 py-2 text-sm text-ink">
          {notice}
        </p>
      )}

      {view === 'table' ? (
        <GagTable seriesId={seriesId} gags={gags} canEdit={canEdit} onStatus={onStatus} />
      ) : (
        <div className="flex gap-3 overflow-x-auto pb-3" aria-label="Gags by status">
          {columns.map((s) => {
            const inColumn = gags.filter((g) => g.status === s);
            return (
              <section key={s} aria-label={STATUS_LABELS[s]} className="w-64 shrink-0 rounded-lg border border-paper-edge bg-paper-deep/50 p-2">
                <h2 className="flex items-center justify-between px-1 pb-2 font-sans text-sm font-bold">
                  <span>{STATUS_LABELS[s]}</span>
                  <span className="rounded-full bg-white px-2 text-xs text-graphite-faint">
                    {inColumn.length}
                    <span className="sr-only"> gags</span>
                  </span>
                </h2>
                <ul className="space-y-2">
                  {inColumn.map((g) => (
                    <li key={g.id}>
                      <GagCard seriesId={seriesId} gag={g} />
                    </li>
                  ))}
                </ul>
              </section>
            );
          })}
        </div>
      )}
    </div>
  );
}

function GagCard({ seriesId, gag }: { seriesId: string; gag: GagDto }) {
  return (
    <article className="panel relative p-3 transition-colors focus-within:border-ink hover:border-ink">
      {gag.latestPass && (
        // eslint-disable-next-line @next/next/no-img-element -- a private, per-pass SVG served by our own route
        <img
          src={`/api/passes/${gag.latestPass.id}/thumbnail.svg?v=${gag.latestPass.seq}`}
          alt={`Pass ${gag.latestPass.number} of “${gag.title}”`}
          width={120}
          height={120}
          loading="lazy"
          className="mb-2 aspect-square w-full rounded border border-paper-edge bg-white"
        />
      )}
      <h3 className="font-sans text-base font-bold leading-snug">
        <Link href={`/series/${seriesId}/gags/${gag.id}`} className="after:absolute after:inset-0 focus:outline-none">
          {gag.title}
        </Link>
      </h3>
      {gag.premise && <p className="mt-1 line-clamp-3 text-sm text-graphite-soft">{gag.premise}</p>}
      {gag.stamp && <StampMark decision={gag.stamp.decision} standing={gag.stamp.standing} passNumber={gag.stamp.passNumber} className="mt-2" />}
      <div className="mt-2 flex items-center justify-between gap-2 text-xs text-graphite-faint">
        <BeatGridMark beats={gag.beats} />
        <StatusBadge status={gag.status} />
      </div>
      <p className="mt-1 text-xs text-graphite-faint">
        Changed <When iso={gag.updatedAt} />
      </p>
    </article>
  );
}
