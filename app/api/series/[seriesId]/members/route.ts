import { listMembers } from '@/db/queries/members';
import { withSeriesRole } from '@/lib/http/route';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

/** Everyone in the series with their role (members need names for @mentions). */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => Response.json(await listMembers(db, seriesId)));
