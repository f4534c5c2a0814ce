import { createPass, listPasses } from '@/db/queries/passes';
import { withSeriesRole } from '@/lib/http/route';
import { createPassSchema } from '@/lib/validation/pass';
import { byGagId } from '@/lib/http/series-of';
import { gagChanged } from '@/lib/live/events';

type Params = { gagId: string };
const seriesOf = byGagId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await listPasses(db, params.gagId)));

/** A new pass, blank or as a copy of an earlier one: `{ copyFrom?: passNumber }`. */
export const POST = withSeriesRole<Params, typeof createPassSchema>(
  'edit',
  seriesOf,
  { body: createPassSchema },
  async ({ db, params, user, seriesId, body }) => {
    const input = body;
    const pass = await createPass(db, { gagId: params.gagId, userId: user.id, copyFrom: input.copyFrom });
    await gagChanged(seriesId, params.gagId, ['passes'], ['gags', 'activity']);
    return Response.json(pass, { status: 201 });
  },
);
