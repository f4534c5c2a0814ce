import { z } from 'zod';
import { beat, present } from '@/db/queries/presence';
import { publish } from '@/lib/live/bus';
import { withSeriesRole } from '@/lib/http/route';
import { byGagId } from '@/lib/http/series-of';
import { presenceWhere, tabId } from '@/lib/validation/live';

type Params = { gagId: string };
const seriesOf = byGagId;
const bodySchema = z
  .object({
    where: presenceWhere,
    // The tab's id, as given to its live stream; tabs without a stream share one row per person.
    tab: tabId.default('poll'),
    panel: z.number().int().min(0).max(3).nullable().optional(),
  })
  .strict();

/** Who has this gag open (seen in the last 20 s), where, and on which panel. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await present(db, params.gagId)));

/** I am here (`{ where, tab, panel }`): a heartbeat without a stream, or a move to another panel. Answers who is. */
export const POST = withSeriesRole<Params, typeof bodySchema>('read', seriesOf, { body: bodySchema }, async ({ db, params, user, body }) => {
  const { where, tab, panel } = body;
  await beat(db, { gagId: params.gagId, tabId: tab, userId: user.id, where, panel });
  await publish({ topic: `gag:${params.gagId}`, type: 'presence' });
  return Response.json(await present(db, params.gagId));
});
