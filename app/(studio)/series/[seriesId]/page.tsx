import type { Metadata } from 'next';
import { ActivityFeed } from '@/components/board/activity-feed';
import { Board } from '@/components/board/board';
import { ChecklistEditor } from '@/components/series/checklist-editor';
import { LiveProvider } from '@/components/live/live-provider';
import { PageSpecForm } from '@/components/series/page-spec-form';
import { VolumesList } from '@/components/volume/volumes-list';
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
        <div className="grid gap-6 lg:grid-cols-2">
          <ActivityFeed seriesId={series.id} />
          <div className="space-y-4">
            <VolumesList seriesId={series.id} canCreate={can(role, 'manage')} />
            <PageSpecForm seriesId={series.id} initial={spec} canEdit={can(role, 'manage')} />
            <ChecklistEditor seriesId={series.id} canEdit={can(role, 'manage')} />
          </div>
        </div>
      </div>
    </LiveProvider>
  );
}
