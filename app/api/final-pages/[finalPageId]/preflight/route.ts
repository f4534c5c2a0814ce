// One final page's preflight where it stands: on its gag's page (the volume's spec once placed) or its matter page.
import { finalPagePreflight } from '@/lib/export/volume-preflight';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byFinalPageId } from '@/lib/http/series-of';

type Params = { finalPageId: string };
const seriesOf = byFinalPageId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params, seriesId }) => {
  const preflight = await finalPagePreflight(db, params.finalPageId, seriesId);
  return preflight ? Response.json(preflight) : jsonError(404, 'Not found.');
});
