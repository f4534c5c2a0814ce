import type { Metadata } from 'next';
import { Board } from '@/components/board/board';
import { loadBoard } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'Board' };
export const dynamic = 'force-dynamic';

export default async function BoardPage({ params }: { params: Promise<{ seriesId: string }> }) {
  const { seriesId } = await params;
  const { series, role, gags } = await loadBoard(seriesId);
  return <Board seriesId={series.id} seriesTitle={series.title} role={role} initialGags={gags} />;
}
