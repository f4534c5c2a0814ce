// The volume's flatplan: every page in running order with what stands for it (its current
// final page, else its newest pass), the spreads and the binding's figures.
import { flatplanFinalOf } from '@/db/queries/final-pages';
import { flatplanOf } from '@/db/queries/volumes';
import { volumeArt } from '@/lib/export/volume-preflight';
import { withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const { volume, entries, finalOf } = await volumeArt(db, params.volumeId);
  return Response.json(
    flatplanOf(volume, entries, (e) => {
      const row = finalOf(e);
      return row ? flatplanFinalOf(row) : null;
    }),
  );
});
