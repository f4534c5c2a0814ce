// A pass as an SVG page, for the board's cards (the same geometry as the editor).
import { passState } from '@/db/queries/passes';
import { pageSpecForPass } from '@/db/queries/series';
import { withSeriesRole } from '@/lib/http/route';
import { passToSvg } from '@/lib/strokes/svg';
import { byPassId } from '@/lib/http/series-of';

type Params = { passId: string };
const seriesOf = byPassId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params, seriesId }) => {
  const state = await passState(db, params.passId);
  if (!state) return new Response(null, { status: 404 });
  const svg = passToSvg(await pageSpecForPass(db, seriesId, params.passId), state.strokes, state.rooms, {
    bleed: false,
    title: `Pass ${state.number}`,
  });
  return new Response(svg, {
    headers: { 'content-type': 'image/svg+xml; charset=utf-8', 'cache-control': 'private, max-age=0, must-revalidate' },
  });
});
