// A gag page's live stream: its passes, comments, stamps, checklist, status and
// presence change. See lib/live/stream.ts.
import { seriesOfGag } from '@/db/queries/gags';
import { withSeriesRole } from '@/lib/http/route';
import { byGagId } from '@/lib/http/series-of';
import { stillReadable, streamParams } from '@/lib/live/access';
import { liveStream } from '@/lib/live/stream';

type Params = { gagId: string };

export const dynamic = 'force-dynamic';

export const GET = withSeriesRole<Params>('read', byGagId, async ({ req, db, params, user, seriesId }) => {
  const q = streamParams(req);
  return liveStream({
    req,
    db,
    userId: user.id,
    topics: [`gag:${params.gagId}`],
    hello: async () => [{ topic: `gag:${params.gagId}`, type: 'hello' }],
    allowed: stillReadable(user.id, seriesId, db, (d) => seriesOfGag(d, params.gagId), req),
    presence: q.tab ? { gagId: params.gagId, tabId: q.tab, where: q.where ?? 'page', panel: null } : undefined,
  });
});
