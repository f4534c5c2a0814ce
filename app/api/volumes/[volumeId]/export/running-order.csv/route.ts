import { listEntries } from '@/db/queries/volumes';
import { runningOrderCsv } from '@/lib/export/volume-export';
import { withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const csv = runningOrderCsv(await listEntries(db, params.volumeId));
  return new Response(csv, {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': 'attachment; filename="running-order.csv"' },
  });
});
