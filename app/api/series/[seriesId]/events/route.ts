// A series board's live stream: gags added, changed, moved or deleted, and the
// activity feed. See lib/live/stream.ts.
import { withSeriesRole } from '@/lib/http/route';
import { bySeriesId } from '@/lib/http/series-of';
import { stillReadable } from '@/lib/live/access';
import { liveStream } from '@/lib/live/stream';

type Params = { seriesId: string };

export const dynamic = 'force-dynamic';

export const GET = withSeriesRole<Params>('read', bySeriesId, async ({ req, db, params, user, seriesId }) =>
  liveStream({
    req,
    db,
    userId: user.id,
    topics: [`series:${params.seriesId}`],
    hello: async () => [{ topic: `series:${params.seriesId}`, type: 'hello' }],
    allowed: stillReadable(user.id, seriesId, db, () => bySeriesId(params), req),
  }),
);
