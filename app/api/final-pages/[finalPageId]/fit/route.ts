// A person fits a final page to the page: to the trim or the bleed, offset, scale and quarter turns.
// It then counts as fitted (a gag in a running order becomes "placed"); the answer carries the page's fresh preflight.
import { setFit } from '@/db/queries/final-pages';
import { finalPagePreflight } from '@/lib/export/volume-preflight';
import { withSeriesRole } from '@/lib/http/route';
import { byFinalPageId } from '@/lib/http/series-of';
import { finalChanged } from '@/lib/live/events';
import { fitSchema } from '@/lib/validation/final-page';

type Params = { finalPageId: string };
const seriesOf = byFinalPageId;

export const PUT = withSeriesRole<Params, typeof fitSchema>('edit', seriesOf, { body: fitSchema }, async ({ db, params, seriesId, user, body }) => {
  const page = await setFit(db, params.finalPageId, body, user.id);
  await finalChanged(seriesId, page, ['gags']);
  // The page's checks at its new fit (the scan's measurements are made once, then kept).
  return Response.json({ ...page, preflight: await finalPagePreflight(db, page.id, seriesId) });
});
