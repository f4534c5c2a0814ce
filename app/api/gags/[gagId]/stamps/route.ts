import { seriesOfGag } from '@/db/queries/gags';
import { stampsOfGag } from '@/db/queries/stamps';
import { withSeriesRole } from '@/lib/http/route';

type Params = { gagId: string };
const seriesOf = (p: Params, db: Parameters<typeof seriesOfGag>[0]) => seriesOfGag(db, p.gagId);

/** Every stamp on this gag's passes, newest first, with whether a later change cleared it. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await stampsOfGag(db, params.gagId)));
