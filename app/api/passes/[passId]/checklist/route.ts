import { passChecklist, setTicks } from '@/db/queries/review';
import { Refused, withSeriesRole } from '@/lib/http/route';
import { checklistPutSchema } from '@/lib/validation/review';
import { byPassId } from '@/lib/http/series-of';
import { passWithGag } from '@/db/queries/pass-info';
import { gagChanged } from '@/lib/live/events';

type Params = { passId: string };
const seriesOf = byPassId;

/** The silent-read checklist of this pass: `[{ id, text, ticked, by, at }]`. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params, seriesId }) =>
  Response.json(await passChecklist(db, seriesId, params.passId)),
);

/**
 * `{ ticked: [itemId], recheck?: [itemId] }`: exactly these items are ticked on this pass (a tick clears
 * the item's "to re-check" mark); with `recheck`, exactly those keep their mark. Anyone who may comment.
 */
export const PUT = withSeriesRole<Params, typeof checklistPutSchema>(
  'comment',
  seriesOf,
  { body: checklistPutSchema },
  async ({ db, params, seriesId, user, body }) => {
    const input = body;
    const problem = await setTicks(db, seriesId, params.passId, user.id, input.ticked, input.recheck);
    if (problem) throw new Refused(422, problem);
    await gagChanged(seriesId, (await passWithGag(db, params.passId))!.gagId, ['checklist']);
    return Response.json(await passChecklist(db, seriesId, params.passId));
  },
);
