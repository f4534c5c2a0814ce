import { VolumeRefused, addEntry, seriesOfVolume } from '@/db/queries/volumes';
import { HttpError, parseBody, withSeriesRole } from '@/lib/http/route';
import { addEntrySchema } from '@/lib/validation/volume';

type Params = { volumeId: string };
const seriesOf = (p: Params, db: Parameters<typeof seriesOfVolume>[0]) => seriesOfVolume(db, p.volumeId);

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
