import { checklistItems, setChecklistItems } from '@/db/queries/review';
import { withSeriesRole } from '@/lib/http/route';
import { checklistItemsSchema } from '@/lib/validation/review';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => Response.json(await checklistItems(db, seriesId)));

/** Owners: `{ items: [{ id?, text }] }` replaces the list (reword, reorder, add, remove). */
export const PUT = withSeriesRole<Params, typeof checklistItemsSchema>(
  'manage',
  seriesOf,
  { body: checklistItemsSchema },
  async ({ db, seriesId, body }) => {
    const input = body;
    return Response.json(await setChecklistItems(db, seriesId, input.items));
  },
);
