// Receives a batch of editor operations; applies it in one transaction, once.
import { applyBatch } from '@/db/queries/passes';
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
    const wanted = [...new Set(batch.ops.flatMap((op) => (op.op === 'lightbox' ? [op.lightbox.uploadId] : [])))];
    if (wanted.length) {
      const known = await uploadsInSeries(db, seriesId, wanted);
      const missing = wanted.find((id) => !known.has(id));
      if (missing) throw new Refused(422, `There is no upload ${missing} in this series to place as a lightbox.`);
    }
    const { seq, stampCleared } = await applyBatch(db, {
      passId: params.passId,
      batchId: batch.batchId,
      ops: batch.ops,
      userId: user.id,
      spec,
    });
    // Announced for a replay too: its original's instance may have died between commit and announcement.
    const gagId = (await passWithGag(db, params.passId))!.gagId;
    await passChanged({ seriesId, gagId, passId: params.passId, seq, stampCleared });
    return Response.json({ seq });
  },
);
