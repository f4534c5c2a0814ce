'use client';
// The board's second row — the activity feed, the volumes, the page setup and the
// checklist — loaded after the board itself is shown: each of them reads its data
// after the page loads anyway, and the board's first load stays light.
import dynamic from 'next/dynamic';
import type { PageSpec } from '@/lib/print/geometry';

export type BoardSideProps = { seriesId: string; canManage: boolean; spec: PageSpec };

const Panels = dynamic(() => import('./board-side-panels').then((m) => m.BoardSidePanels), {
  ssr: false,
  loading: () => (
    <p role="status" className="py-6 text-center text-sm text-graphite-faint">
      Loading the activity and the volumes…
    </p>
  ),
});

export function BoardSide(props: BoardSideProps) {
  return <Panels {...props} />;
}
