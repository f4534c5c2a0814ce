import type { Metadata } from 'next';
import { LiveProvider } from '@/components/live/live-provider';
import { CompareView } from '@/components/review/compare-view';
import { loadGag, loadPassThumbnails } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'Compare passes' };
export const dynamic = 'force-dynamic';

export default async function ComparePage({ params }: { params: Promise<{ seriesId: string; gagId: string }> }) {
  const { seriesId, gagId } = await params;
  const { series, gag, user } = await loadGag(seriesId, gagId);
  const { spec, passes } = await loadPassThumbnails(series.id, gag.id);
  return (
    <LiveProvider url={`/api/gags/${gag.id}/events`} gagId={gag.id} where="compare">
      <CompareView
        seriesId={series.id}
        gagId={gag.id}
        gagTitle={gag.title}
        meId={user.id}
        spec={spec}
        passes={passes.map((p) => ({ id: p.id, number: p.number, svg: p.svg }))}
      />
    </LiveProvider>
  );
}
