import { createVolume, listVolumes } from '@/db/queries/volumes';
import { Refused, withSeriesRole } from '@/lib/http/route';
import { DEFAULT_VOLUME_SPEC } from '@/lib/print/book';
import { createVolumeSchema, specIssues } from '@/lib/validation/volume';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => Response.json(await listVolumes(db, seriesId)));

/** Owners: `{ title, deadline, hoursPerWeek?, spec? }` → 201. */
export const POST = withSeriesRole<Params, typeof createVolumeSchema>(
  'manage',
  seriesOf,
  { body: createVolumeSchema },
  async ({ db, seriesId, body }) => {
    const input = body;
    const problems = specIssues({ ...DEFAULT_VOLUME_SPEC, ...input.spec });
    if (problems.length) throw new Refused(422, problems.join(' '));
    return Response.json(await createVolume(db, { seriesId, ...input }), { status: 201 });
  },
);
