import type { Metadata } from 'next';
import { Board } from '@/components/board/board';
import { BoardSide } from '@/components/board/board-side';
import { LiveProvider } from '@/components/live/live-provider';
import { can } from '@/lib/auth/permissions';
import { loadBoard } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'Board' };
export const dynamic = 'force-dynamic';

export default async function BoardPage({ params }: { params: Promise<{ seriesId: string }> }) {
  const { seriesId } = await params;
  const { series, role, gags, spec } = await loadBoard(seriesId);
  return (
    <LiveProvider url={`/api/series/${series.id}/events`}>
      <div className="space-y-6">
        <Board seriesId={series.id} seriesTitle={series.title} role={role} initialGags={gags} />
        <BoardSide seriesId={series.id} canManage={can(role, 'manage')} spec={spec} />
      </div>
    </LiveProvider>
  );
}
