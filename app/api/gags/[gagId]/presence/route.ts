import { beat, present } from '@/db/queries/presence';
import { publish } from '@/lib/live/bus';
import { withSeriesRole } from '@/lib/http/route';
import { byGagId } from '@/lib/http/series-of';
import { presenceBeatSchema } from '@/lib/validation/live';

type Params = { gagId: string };
const seriesOf = byGagId;

/** Who has this gag open (seen in the last 20 s), where, and on which panel. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await present(db, params.gagId)));

/** I am here (`{ where, tab, panel }`): a heartbeat without a stream, or a move to another panel. Answers who is. */
export const POST = withSeriesRole<Params, typeof presenceBeatSchema>(
  'read',
  seriesOf,
  { body: presenceBeatSchema },
  async ({ db, params, user, body }) => {
    const { where, tab, panel } = body;
    await beat(db, { gagId: params.gagId, tabId: tab, userId: user.id, where, panel });
    await publish({ topic: `gag:${params.gagId}`, type: 'presence' });
    return Response.json(await present(db, params.gagId));
  },
);
