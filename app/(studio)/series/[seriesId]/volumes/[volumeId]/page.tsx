import type { Metadata } from 'next';
import { LiveProvider } from '@/components/live/live-provider';
import { VolumePage } from '@/components/volume/volume-page';
import { loadVolume } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'Volume' };
export const dynamic = 'force-dynamic';

export default async function Volume({ params }: { params: Promise<{ seriesId: string; volumeId: string }> }) {
  const { seriesId, volumeId } = await params;
  const { series, role, volume } = await loadVolume(seriesId, volumeId);
  // The series' stream: gags' status moves reach the running order's badges and the flatplan.
  return (
    <LiveProvider url={`/api/series/${series.id}/events`}>
      <VolumePage seriesId={series.id} seriesTitle={series.title} role={role} initial={volume} />
    </LiveProvider>
  );
}
