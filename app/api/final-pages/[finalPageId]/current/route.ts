// Goes back to an earlier final page (or forward again): it becomes the current one.
import { makeFinalPageCurrent } from '@/db/queries/final-pages';
import { withSeriesRole } from '@/lib/http/route';
import { byFinalPageId } from '@/lib/http/series-of';
import { finalChanged } from '@/lib/live/events';

type Params = { finalPageId: string };
const seriesOf = byFinalPageId;

export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ db, params, seriesId, user }) => {
  const page = await makeFinalPageCurrent(db, params.finalPageId, user.id);
  await finalChanged(seriesId, page, ['gags']);
  return Response.json(page);
});
