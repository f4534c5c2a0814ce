import { addEntry } from '@/db/queries/volumes';
import { withSeriesRole } from '@/lib/http/route';
import { addEntrySchema } from '@/lib/validation/volume';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

/** `{ gagId }` places a gag (once); `{ kind }` adds a matter page. Appended at the end. */
export const POST = withSeriesRole<Params, typeof addEntrySchema>(
  'edit',
  seriesOf,
  { body: addEntrySchema },
  async ({ db, params, seriesId, body }) => {
    const input = body;
    return Response.json(await addEntry(db, params.volumeId, seriesId, input), { status: 201 });
  },
);
