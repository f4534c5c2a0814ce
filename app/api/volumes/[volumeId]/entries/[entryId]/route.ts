import { removeEntry, setMatterDone } from '@/db/queries/volumes';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { entryDoneSchema } from '@/lib/validation/volume';

type Params = { volumeId: string; entryId: string };
const seriesOf = byVolumeId;

/** `{ done }` for a matter page: the planner counts its hours until it is done. A gag's page: 422. */
export const PATCH = withSeriesRole<Params, typeof entryDoneSchema>('edit', seriesOf, { body: entryDoneSchema }, async ({ db, params, body }) => {
  await setMatterDone(db, params.volumeId, params.entryId, body.done);
  return Response.json({ id: params.entryId, done: body.done });
});

export const DELETE = withSeriesRole<Params>('edit', seriesOf, async ({ db, params }) => {
  if (!(await removeEntry(db, params.volumeId, params.entryId))) return jsonError(404, 'Not found.');
  return new Response(null, { status: 204 });
});
