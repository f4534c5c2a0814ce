// Receives a batch of editor operations; applies it in one transaction, once.
import { applyBatch } from '@/db/queries/batches';
import { pageSpecForPass } from '@/db/queries/series';
import { Refused, withSeriesRole } from '@/lib/http/route';
import { MAX_BATCH_BYTES } from '@/lib/strokes/types';
import { batchSchema, checkOpsInside } from '@/lib/validation/pass';
import { byPassId } from '@/lib/http/series-of';
import { uploadsInSeries } from '@/db/queries/uploads';
import { passWithGag } from '@/db/queries/pass-info';
import { passChanged } from '@/lib/live/events';

type Params = { passId: string };
const seriesOf = byPassId;

export const POST = withSeriesRole<Params, typeof batchSchema>(
  'edit',
  seriesOf,
  { body: batchSchema, maxBytes: MAX_BATCH_BYTES },
  async ({ db, params, user, seriesId, body }) => {
    const batch = body;
    const spec = await pageSpecForPass(db, seriesId, params.passId);
    const outside = checkOpsInside(batch.ops, spec);
    if (outside) throw new Refused(422, outside);
    // A lightbox whose upload is not (or no longer) in the series is skipped, not the whole batch: someone
    // deleting a scan must not turn a stroke drawn beside a nudge into a refused batch. Only a batch with
    // nothing else in it is refused.
    const wanted = [...new Set(batch.ops.flatMap((op) => (op.op === 'lightbox' ? [op.lightbox.uploadId] : [])))];
    const known = wanted.length ? await uploadsInSeries(db, seriesId, wanted) : new Set<string>();
    const stale = (op: (typeof batch.ops)[number]) => op.op === 'lightbox' && !known.has(op.lightbox.uploadId);
    const ops = batch.ops.filter((op) => !stale(op));
    const skipped = batch.ops.filter(stale).map((op) => ({
      op: 'lightbox',
      id: op.op === 'lightbox' ? op.lightbox.id : '',
      reason: `There is no upload ${op.op === 'lightbox' ? op.lightbox.uploadId : ''} in this series to place as a lightbox.`,
    }));
    if (ops.length === 0) throw new Refused(422, skipped[0]!.reason);
    const { seq, stampCleared } = await applyBatch(db, {
      passId: params.passId,
      batchId: batch.batchId,
      ops,
      userId: user.id,
      spec,
    });
    // Announced for a replay too: its original's instance may have died between commit and announcement.
    const gagId = (await passWithGag(db, params.passId))!.gagId;
    await passChanged({ seriesId, gagId, passId: params.passId, seq, stampCleared });
    return Response.json(skipped.length ? { seq, skipped } : { seq });
  },
);
