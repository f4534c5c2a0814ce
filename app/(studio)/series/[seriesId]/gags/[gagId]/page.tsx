import type { Metadata } from 'next';
import { GagDetail } from '@/components/gag/gag-detail';
import { loadGag } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'Gag' };
export const dynamic = 'force-dynamic';

export default async function GagPage({ params }: { params: Promise<{ seriesId: string; gagId: string }> }) {
  const { seriesId, gagId } = await params;
  const { series, role, gag } = await loadGag(seriesId, gagId);
  return <GagDetail key={gag.id} seriesId={series.id} seriesTitle={series.title} role={role} initial={gag} />;
}
