import { removeEntry } from '@/db/queries/volumes';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string; entryId: string };
const seriesOf = byVolumeId;

export const DELETE = withSeriesRole<Params>('edit', seriesOf, async ({ db, params }) => {
  if (!(await removeEntry(db, params.volumeId, params.entryId))) return jsonError(404, 'Not found.');
  return new Response(null, { status: 204 });
});
