'use client';
// The table view of the board (TanStack Table): sortable columns; the search
// and status filter are applied by the board before rows arrive here.
import { type ColumnDef, type SortingState, flexRender, getCoreRowModel, getSortedRowModel, useReactTable } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import Link from 'next/link';
import { useMemo, useState } from 'react';
import { StatusSelect } from '@/components/gag/status-select';
import { BeatGridMark } from '@/components/ui/beat-grid-mark';
import { StatusBadge } from '@/components/ui/status-badge';
import { When } from '@/components/ui/when';
import type { GagDto } from '@/db/queries/gags';
import { GAG_STATUSES, type GagStatus } from '@/lib/gags/status';

export function GagTable({
  seriesId,
  gags,
  canEdit,
  onStatus,
}: {
  seriesId: string;
  gags: GagDto[];
  canEdit: boolean;
  onStatus: (gag: GagDto, status: GagStatus) => void;
}) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'updatedAt', desc: true }]);
  const columns = useMemo<ColumnDef<GagDto>[]>(
    () => [
      {
        id: 'title',
        accessorKey: 'title',
        header: 'Title',
        cell: ({ row }) => (
          <div>
            <Link href={`/series/${seriesId}/gags/${row.original.id}`} className="font-bold text-ink hover:underline">
              {row.original.title}
            </Link>
            {row.original.premise && <p className="text-sm text-graphite-soft">{row.original.premise}</p>}
          </div>
        ),
      },
      {
        id: 'status',
        accessorFn: (g) => GAG_STATUSES.indexOf(g.status),
        header: 'Status',
        cell: ({ row }) =>
          canEdit ? (
            <StatusSelect
              id={`status-${row.original.id}`}
              label={`Status of ${row.original.title}`}
              status={row.original.status}
              onChange={(s) => onStatus(row.original, s)}
            />
          ) : (
            <StatusBadge status={row.original.status} />
          ),
      },
      {
        id: 'beatsWritten',
        accessorKey: 'beatsWritten',
        header: 'Beats written',
        cell: ({ row }) => <BeatGridMark beats={row.original.beats} />,
      },
      {
        id: 'updatedAt',
        accessorKey: 'updatedAt',
        header: 'Last change',
        cell: ({ row }) => <When iso={row.original.updatedAt} />,
      },
    ],
    [seriesId, canEdit, onStatus],
  );
  // TanStack Table hands back functions the React Compiler cannot memoize; this table re-renders as a whole.
  // eslint-disable-next-line react-hooks/incompatible-library -- see the line above
  const table = useReactTable({
    data: gags,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  return (
    <div className="panel overflow-x-auto">
      <table className="w-full min-w-[640px] text-left text-sm">
        <thead className="border-b border-paper-edge bg-paper-deep/60">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const dir = h.column.getIsSorted();
                const Icon = dir === 'asc' ? ArrowUp : dir === 'desc' ? ArrowDown : ArrowUpDown;
                return (
                  <th key={h.id} scope="col" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'} className="px-3 py-2">
                    <button
                      type="button"
                      onClick={h.column.getToggleSortingHandler()}
                      className="inline-flex items-center gap-1 rounded font-bold text-graphite-soft hover:text-graphite"
                    >
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <Icon aria-hidden className="h-3.5 w-3.5" />
                    </button>
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-paper-edge/60 last:border-0">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-3 py-2 align-top">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {gags.length === 0 && <p className="p-4 text-graphite-soft">No gags match.</p>}
    </div>
  );
}
