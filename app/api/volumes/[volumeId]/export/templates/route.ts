// What the blue-line export offers for this volume: the scale × paper sizes that fit one
// sheet (or tile across several), the guide colours, and the gag pages with their approved
// pass, the ready ones chosen by default.
import { findVolume } from '@/db/queries/volumes';
import { sheetChoice } from '@/lib/export/volume-export';
import { withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { GUIDE_NAMES, GUIDE_STRENGTH, sheetSizes } from '@/lib/print/sheets';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const volume = (await findVolume(db, params.volumeId))!;
  const { gags, defaults } = await sheetChoice(db, params.volumeId);
  return Response.json({
    sizes: sheetSizes(volume.spec),
    guides: GUIDE_NAMES,
    strength: GUIDE_STRENGTH,
    gags,
    defaults,
  });
});
