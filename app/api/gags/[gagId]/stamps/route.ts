import { stampsOfGag } from '@/db/queries/stamps';
import { withSeriesRole } from '@/lib/http/route';
import { byGagId } from '@/lib/http/series-of';

type Params = { gagId: string };
const seriesOf = byGagId;

/** Every stamp on this gag's passes, newest first, with whether a later change cleared it. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await stampsOfGag(db, params.gagId)));
