import { z } from 'zod';
import { beat, present } from '@/db/queries/presence';
import { parseBody, withSeriesRole } from '@/lib/http/route';
import { byGagId } from '@/lib/http/series-of';

type Params = { gagId: string };
const seriesOf = byGagId;
const bodySchema = z.object({ where: z.string().regex(/^(page|pass:\d{1,4}|compare)$/, 'where is "page", "compare" or "pass:N".') }).strict();

/** Who has this gag open (seen in the last 20 s), and where. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await present(db, `${params.gagId}:`)));

/** A heartbeat: I am here (`{ where }`); answers who is. */
export const POST = withSeriesRole<Params>('read', seriesOf, async ({ req, db, params, user }) => {
  const { where } = await parseBody(req, bodySchema);
  await beat(db, `${params.gagId}:${where}`, user.id);
  return Response.json(await present(db, `${params.gagId}:`));
});
