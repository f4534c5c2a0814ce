import type { Metadata } from 'next';
import { SeriesIndex } from '@/components/series/series-index';
import { loadSeriesIndex } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'My series' };
export const dynamic = 'force-dynamic';

export default async function SeriesPage() {
  const { series } = await loadSeriesIndex();
  return <SeriesIndex initial={series} />;
}
