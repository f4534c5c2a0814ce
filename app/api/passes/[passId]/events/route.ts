// The editor's live stream: the pass's new seqs (then read ?since=seq), its gag's
// comments and presence, and who is on which panel. See lib/live/stream.ts.
import { seriesOfPass } from '@/db/queries/passes';
import { passWithGag } from '@/db/queries/pass-info';
import { withSeriesRole } from '@/lib/http/route';
import { byPassId } from '@/lib/http/series-of';
import { stillReadable, streamParams } from '@/lib/live/access';
import { liveStream } from '@/lib/live/stream';

type Params = { passId: string };

export const dynamic = 'force-dynamic';

export const GET = withSeriesRole<Params>('read', byPassId, async ({ req, db, params, user, seriesId }) => {
  const q = streamParams(req);
  const pass = (await passWithGag(db, params.passId))!;
  return liveStream({
    req,
    db,
    userId: user.id,
    topics: [`pass:${pass.id}`, `gag:${pass.gagId}`],
    hello: async () => [{ topic: `pass:${pass.id}`, type: 'seq', seq: (await passWithGag(db, pass.id))?.seq ?? pass.seq }],
    allowed: stillReadable(user.id, seriesId, db, (d) => seriesOfPass(d, pass.id), req),
    presence: q.tab ? { gagId: pass.gagId, tabId: q.tab, where: `pass:${pass.number}`, panel: q.panel ?? null } : undefined,
  });
});
