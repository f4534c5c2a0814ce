import { findVolume, listEntries, planOf } from '@/db/queries/volumes';
import { withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const volume = (await findVolume(db, params.volumeId))!;
  return Response.json({
    deadline: volume.deadline,
    hoursPerWeek: volume.hoursPerWeek,
    hoursPerPage: volume.hoursPerPage,
    ...planOf(volume, await listEntries(db, params.volumeId)),
  });
});
