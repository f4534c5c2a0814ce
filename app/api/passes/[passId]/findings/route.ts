// Readability findings computed from the strokes (lib/review/findings).
import { findGag } from '@/db/queries/gags';
import { passState } from '@/db/queries/passes';
import { inkThresholdOf } from '@/db/queries/review';
import { pageSpecForPass } from '@/db/queries/series';
import { withSeriesRole } from '@/lib/http/route';
import { type Findings, computeFindings } from '@/lib/review/findings';
import { byPassId } from '@/lib/http/series-of';

type Params = { passId: string };
const seriesOf = byPassId;

// Findings only change with the pass (seq), the beat notes or the spec: remember a few.
const cache = new Map<string, Findings>();

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params, seriesId }) => {
  const state = await passState(db, params.passId);
  const gag = state && (await findGag(db, state.gagId));
  if (!state || !gag) return Response.json({ error: 'Not found.' }, { status: 404 });
  const spec = await pageSpecForPass(db, seriesId, params.passId);
  const threshold = await inkThresholdOf(db, seriesId);
  const key = `${params.passId}:${state.seq}:${gag.updatedAt}:${JSON.stringify(spec)}:${threshold}`;
  let findings = cache.get(key);
  if (!findings) {
    findings = computeFindings(spec, state.strokes, state.rooms, gag.beats, threshold);
    cache.set(key, findings);
    if (cache.size > 64) cache.delete(cache.keys().next().value!);
  }
  return Response.json(findings);
});
