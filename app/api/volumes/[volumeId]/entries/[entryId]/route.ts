import { removeEntry, seriesOfVolume } from '@/db/queries/volumes';
import { jsonError, withSeriesRole } from '@/lib/http/route';

type Params = { volumeId: string; entryId: string };
const seriesOf = (p: Params, db: Parameters<typeof seriesOfVolume>[0]) => seriesOfVolume(db, p.volumeId);

export const DELETE = withSeriesRole<Params>('edit', seriesOf, async ({ db, params }) => {
  if (!(await removeEntry(db, params.volumeId, params.entryId))) return jsonError(404, 'Not found.');
  return new Response(null, { status: 204 });
});
