import { VolumeRefused, addEntry } from '@/db/queries/volumes';
import { HttpError, parseBody, withSeriesRole } from '@/lib/http/route';
import { addEntrySchema } from '@/lib/validation/volume';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

/** `{ gagId }` places a gag (once); `{ kind }` adds a matter page. Appended at the end. */
export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ req, db, params, seriesId }) => {
  const input = await parseBody(req, addEntrySchema);
  try {
    return Response.json(await addEntry(db, params.volumeId, seriesId, input), { status: 201 });
  } catch (err) {
    if (err instanceof VolumeRefused) throw new HttpError(err.status, err.message);
    throw err;
  }
});
