// Readability findings computed from the strokes (lib/review/findings), in a
// worker thread; kept by what they depend on (the pass's seq, the beat notes,
// the spec and the ink threshold).
import { findGag } from '@/db/queries/gags';
import { findPass } from '@/db/queries/passes';
import { inkThresholdOf } from '@/db/queries/review';
import { pageSpecForPass } from '@/db/queries/series';
import { withSeriesRole } from '@/lib/http/route';
import { byPassId } from '@/lib/http/series-of';
import type { Findings } from '@/lib/review/findings';
import { remembered } from '@/lib/remembered';
import { runHeavy } from '@/lib/workers/pool';

type Params = { passId: string };
const seriesOf = byPassId;

type Found = { seq: number; findings: Findings } | null;
const found = remembered<Found>({ maxBytes: 8 * 1024 * 1024, sizeOf: (f) => (f ? JSON.stringify(f.findings).length : 0) });

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params, seriesId }) => {
  const pass = await findPass(db, params.passId);
  const gag = pass && (await findGag(db, pass.gagId));
  if (!pass || !gag) return Response.json({ error: 'Not found.' }, { status: 404 });
  const spec = await pageSpecForPass(db, seriesId, params.passId);
  const threshold = await inkThresholdOf(db, seriesId);
  const key = `${params.passId}:${pass.seq}:${gag.updatedAt}:${JSON.stringify(spec)}:${threshold}`;
  const result = await found.get(key, () => runHeavy('findings', { passId: params.passId, seriesId }));
  if (!result) return Response.json({ error: 'Not found.' }, { status: 404 });
  return Response.json(result.findings);
});
