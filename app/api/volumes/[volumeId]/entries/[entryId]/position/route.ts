import { moveEntry } from '@/db/queries/volumes';
import { withSeriesRole } from '@/lib/http/route';
import { moveEntrySchema } from '@/lib/validation/volume';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string; entryId: string };
const seriesOf = byVolumeId;

/** `{ before: entryId }` or `{ after: entryId }`: one row is rewritten. */
export const PUT = withSeriesRole<Params, typeof moveEntrySchema>('edit', seriesOf, { body: moveEntrySchema }, async ({ db, params, body }) => {
  const to = body;
  return Response.json({ id: params.entryId, position: await moveEntry(db, params.volumeId, params.entryId, to) });
});
