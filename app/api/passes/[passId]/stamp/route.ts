import { stampPass } from '@/db/queries/stamps';
import { notifyStamp } from '@/lib/mail/notify';
import { withSeriesRole } from '@/lib/http/route';
import { stampSchema } from '@/lib/validation/review';
import { byPassId } from '@/lib/http/series-of';
import { passWithGag } from '@/db/queries/pass-info';
import { gagChanged } from '@/lib/live/events';

type Params = { passId: string };
const seriesOf = byPassId;

/** Editors and owners: `{ decision: "ready" | "again", note }`. */
export const POST = withSeriesRole<Params, typeof stampSchema>(
  'stamp',
  seriesOf,
  { body: stampSchema },
  async ({ db, params, user, seriesId, body }) => {
    const input = body;
    const stamp = await stampPass(db, { passId: params.passId, userId: user.id, decision: input.decision, note: input.note });
    await gagChanged(seriesId, (await passWithGag(db, params.passId))!.gagId, ['stamps', 'gag'], ['gags', 'activity']);
    await notifyStamp(db, { stampId: stamp.id, by: user });
    return Response.json(stamp, { status: 201 });
  },
);
