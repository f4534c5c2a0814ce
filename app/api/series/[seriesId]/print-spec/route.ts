import { pageSpecOf, setPageSpec } from '@/db/queries/series';
import { withSeriesRole } from '@/lib/http/route';
import { pageSpecSchema } from '@/lib/validation/pass';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

/** The series' default page spec (mm): trim, bleed, safe margin, gutter. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => Response.json(await pageSpecOf(db, seriesId)));

export const PUT = withSeriesRole<Params, typeof pageSpecSchema>('manage', seriesOf, { body: pageSpecSchema }, async ({ db, seriesId, body }) => {
  const spec = body;
  await setPageSpec(db, seriesId, spec);
  return Response.json(spec);
});
