'use client';
// What BoardSide loads: the activity feed beside the series' volumes, page setup and checklist.
import { ActivityFeed } from '@/components/board/activity-feed';
import { ChecklistEditor } from '@/components/series/checklist-editor';
import { PageSpecForm } from '@/components/series/page-spec-form';
import { VolumesList } from '@/components/volume/volumes-list';
import type { BoardSideProps } from './board-side';

export function BoardSidePanels({ seriesId, canManage, spec }: BoardSideProps) {
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <ActivityFeed seriesId={seriesId} />
      <div className="space-y-4">
        <VolumesList seriesId={seriesId} canCreate={canManage} />
        <PageSpecForm seriesId={seriesId} initial={spec} canEdit={canManage} />
        <ChecklistEditor seriesId={seriesId} canEdit={canManage} />
      </div>
    </div>
  );
}
