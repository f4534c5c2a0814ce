import type { Metadata } from 'next';
import { MembersPage } from '@/components/members/members-page';
import { can } from '@/lib/auth/permissions';
import { loadSeriesPage } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'Members' };
export const dynamic = 'force-dynamic';

export default async function Members({ params }: { params: Promise<{ seriesId: string }> }) {
  const { seriesId } = await params;
  const { series, role, user } = await loadSeriesPage(seriesId, `/series/${seriesId}/members`);
  return <MembersPage seriesId={series.id} seriesTitle={series.title} canManage={can(role, 'manage')} meId={user.id} />;
}
