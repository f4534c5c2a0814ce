import { findVolume, listEntries, unplacedGags, updateVolume } from '@/db/queries/volumes';
import { Refused, withSeriesRole } from '@/lib/http/route';
import { specIssues, updateVolumeSchema } from '@/lib/validation/volume';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

/** The volume with its running order, and the series' gags not yet placed anywhere. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params, seriesId }) => {
  const volume = await findVolume(db, params.volumeId);
  return Response.json({ ...volume, entries: await listEntries(db, params.volumeId), unplaced: await unplacedGags(db, seriesId) });
});

/** Owners change the title, deadline, hours and print spec. */
export const PATCH = withSeriesRole<Params, typeof updateVolumeSchema>(
  'manage',
  seriesOf,
  { body: updateVolumeSchema },
  async ({ db, params, body }) => {
    const patch = body;
    const cur = (await findVolume(db, params.volumeId))!;
    const problems = specIssues({ ...cur.spec, ...patch.spec });
    if (problems.length) throw new Refused(422, problems.join(' '));
    return Response.json(await updateVolume(db, params.volumeId, patch));
  },
);
