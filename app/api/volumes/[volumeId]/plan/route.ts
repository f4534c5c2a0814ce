import { findVolume, listEntries, planOf, seriesOfVolume } from '@/db/queries/volumes';
import { withSeriesRole } from '@/lib/http/route';

type Params = { volumeId: string };
const seriesOf = (p: Params, db: Parameters<typeof seriesOfVolume>[0]) => seriesOfVolume(db, p.volumeId);

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const volume = (await findVolume(db, params.volumeId))!;
  return Response.json({ deadline: volume.deadline, hoursPerWeek: volume.hoursPerWeek, hoursPerPage: volume.hoursPerPage, ...planOf(volume, await listEntries(db, params.volumeId)) });
});
