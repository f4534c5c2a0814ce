'use client';
// The board of one series: gags grouped by status (columns) or as a sortable
// table, with a shared search and status filter.
import dynamic from 'next/dynamic';
import Link from 'next/link';
import { useCallback, useMemo, useState } from 'react';
import { LoupeGlyph, PanelsGlyph, RowsGlyph } from '@/components/ui/board-glyphs';
import type { GagDto } from '@/db/queries/gags';
import { useGags } from '@/hooks/use-gags';
import { ROLE_LABELS, type Role, can } from '@/lib/auth/permissions';
import { filterGags, searchHint } from '@/lib/gags/filter';
import { GAG_STATUSES, type GagStatus, STATUS_LABELS } from '@/lib/gags/status';
import { messageOf } from '@/lib/http/client';
import { BoardColumns } from './board-columns';
import { counted } from '@/lib/counted';

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
            placeholder={searchHint(data ?? [])}
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
          {gags.length} of {counted(data?.length ?? 0, 'gag')}
        </p>
      </div>
      {notice && (
        <p role="status" data-testid="board-notice" className="rounded-md bg-ink-light px-3 py-2 text-sm text-ink">
          {notice}
        </p>
      )}

      {view === 'table' ? (
        <GagTable seriesId={seriesId} gags={gags} canEdit={canEdit} onStatus={onStatus} />
      ) : (
        <BoardColumns
          seriesId={seriesId}
          gags={gags}
          columns={columns}
          canEdit={canEdit}
          onMove={onStatus}
          onRefused={(message) => setNotice(message)}
        />
      )}
    </div>
  );
}
