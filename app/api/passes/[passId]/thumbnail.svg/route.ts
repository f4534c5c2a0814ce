// A pass as an SVG page, for the board's cards (the same geometry as the editor).
import { passState, seriesOfPass } from '@/db/queries/passes';
import { pageSpecForPass } from '@/db/queries/series';
import { withSeriesRole } from '@/lib/http/route';
import { passToSvg } from '@/lib/strokes/svg';

type Params = { passId: string };
const seriesOf = (p: Params, db: Parameters<typeof seriesOfPass>[0]) => seriesOfPass(db, p.passId);

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params, seriesId }) => {
  const state = await passState(db, params.passId);
  if (!state) return new Response(null, { status: 404 });
  const svg = passToSvg(await pageSpecForPass(db, seriesId, params.passId), state.strokes, state.rooms, { bleed: false, title: `Pass ${state.number}` });
  return new Response(svg, {
    headers: { 'content-type': 'image/svg+xml; charset=utf-8', 'cache-control': 'private, max-age=0, must-revalidate' },
  });
});
