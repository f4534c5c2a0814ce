import { listRevisions } from '@/db/queries/revisions';
import { withSeriesRole } from '@/lib/http/route';
import { byPassId } from '@/lib/http/series-of';

type Params = { passId: string };
const seriesOf = byPassId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await listRevisions(db, params.passId)));
