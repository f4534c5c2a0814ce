import { carryTicks, passChecklist } from '@/db/queries/review';
import { withSeriesRole } from '@/lib/http/route';
import { checklistCarrySchema } from '@/lib/validation/review';
import { byPassId } from '@/lib/http/series-of';
import { passWithGag } from '@/db/queries/pass-info';
import { gagChanged } from '@/lib/live/events';

type Params = { passId: string };

/**
 * `{ from? }`: the items ticked on an earlier pass (by default the one just before) are marked
 * "to re-check" on this pass, unless already ticked here → the checklist, as GET answers it.
 */
export const POST = withSeriesRole<Params, typeof checklistCarrySchema>(
  'comment',
  byPassId,
  { body: checklistCarrySchema },
  async ({ db, params, seriesId, user, body }) => {
    await carryTicks(db, seriesId, params.passId, user.id, body.from);
    await gagChanged(seriesId, (await passWithGag(db, params.passId))!.gagId, ['checklist']);
    return Response.json(await passChecklist(db, seriesId, params.passId));
  },
);
