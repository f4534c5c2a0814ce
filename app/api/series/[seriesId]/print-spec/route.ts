import { findSeries, pageSpecOf, setPageSpec } from '@/db/queries/series';
import { parseBody, withSeriesRole } from '@/lib/http/route';
import { pageSpecSchema } from '@/lib/validation/pass';

type Params = { seriesId: string };
const seriesOf = async (p: Params, db: Parameters<typeof findSeries>[0]) => (await findSeries(db, p.seriesId))?.id ?? null;

/** The series' default page spec (mm): trim, bleed, safe margin, gutter. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => Response.json(await pageSpecOf(db, seriesId)));

export const PUT = withSeriesRole<Params>('manage', seriesOf, async ({ req, db, seriesId }) => {
  const spec = await parseBody(req, pageSpecSchema);
  await setPageSpec(db, seriesId, spec);
  return Response.json(spec);
});
