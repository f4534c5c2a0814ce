'use client';
// The board's status columns. Everyone sees them at once; for people who may move gags
// the drag-and-keyboard version (./board-dnd, with dnd-kit) takes over once loaded.
import dynamic from 'next/dynamic';
import { useCallback, useState } from 'react';
import type { GagDto } from '@/db/queries/gags';
import type { GagStatus } from '@/lib/gags/status';
import { Column, ColumnsFrame, GagCard } from './board-cards';

type Props = {
  seriesId: string;
  gags: GagDto[];
  columns: readonly GagStatus[];
  canEdit: boolean;
  onMove: (gag: GagDto, to: GagStatus) => Promise<void>;
  onRefused: (message: string) => void;
};

function StillColumns({ seriesId, gags, columns }: Pick<Props, 'seriesId' | 'gags' | 'columns'>) {
  return (
    <ColumnsFrame>
      {columns.map((s) => {
        const inColumn = gags.filter((g) => g.status === s);
        return (
          <Column key={s} status={s} count={inColumn.length}>
            {inColumn.map((g) => (
              <li key={g.id}>
                <GagCard seriesId={seriesId} gag={g} />
              </li>
            ))}
          </Column>
        );
      })}
    </ColumnsFrame>
  );
}

const MovableColumns = dynamic(() => import('./board-dnd').then((m) => m.MovableColumns), { ssr: false });

export function BoardColumns({ canEdit, ...props }: Props) {
  const [ready, setReady] = useState(false);
  const onReady = useCallback(() => setReady(true), []);
  if (!canEdit) return <StillColumns {...props} />;
  // Until the movable columns arrive (after the board is shown), the same columns, still.
  return (
    <>
      {!ready && <StillColumns {...props} />}
      <MovableColumns {...props} onReady={onReady} />
    </>
  );
}
