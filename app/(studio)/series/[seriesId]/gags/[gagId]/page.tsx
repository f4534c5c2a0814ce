import type { Metadata } from 'next';
import { FinalPagePanel } from '@/components/final/final-page-panel';
import { GagDetail } from '@/components/gag/gag-detail';
import { LiveProvider } from '@/components/live/live-provider';
import { PassStrip } from '@/components/gag/pass-strip';
import { ReviewSection } from '@/components/review/review-section';
import { UploadsPanel } from '@/components/uploads/uploads-panel';
import { can } from '@/lib/auth/permissions';
import { loadGag } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'Gag' };
export const dynamic = 'force-dynamic';

export default async function GagPage({ params }: { params: Promise<{ seriesId: string; gagId: string }> }) {
  const { seriesId, gagId } = await params;
  const { series, role, gag, user, passes, spec } = await loadGag(seriesId, gagId);
  return (
    <LiveProvider url={`/api/gags/${gag.id}/events`} gagId={gag.id} where="page">
      <div className="space-y-8">
        <GagDetail key={gag.id} seriesId={series.id} seriesTitle={series.title} role={role} initial={gag} />
        <PassStrip seriesId={series.id} gagId={gag.id} passes={passes} beats={gag.beats} canEdit={can(role, 'edit')} />
        <FinalPagePanel title="Final page" listUrl={`/api/gags/${gag.id}/final-pages`} spec={spec} canEdit={can(role, 'edit')} />
        <UploadsPanel seriesId={series.id} canUpload={can(role, 'edit')} />
        <ReviewSection
          seriesId={series.id}
          gagId={gag.id}
          role={role}
          meId={user.id}
          passes={passes.map((p) => ({ id: p.id, number: p.number, seq: p.seq }))}
        />
      </div>
    </LiveProvider>
  );
}
