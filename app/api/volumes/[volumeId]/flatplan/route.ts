import { findVolume, flatplanOf, listEntries } from '@/db/queries/volumes';
import { withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const volume = (await findVolume(db, params.volumeId))!;
  return Response.json(flatplanOf(volume, await listEntries(db, params.volumeId)));
});
