import { listMembers } from '@/db/queries/members';
import { findSeries } from '@/db/queries/series';
import { withSeriesRole } from '@/lib/http/route';

type Params = { seriesId: string };
const seriesOf = async (p: Params, db: Parameters<typeof findSeries>[0]) => (await findSeries(db, p.seriesId))?.id ?? null;

/** Everyone in the series with their role (members need names for @mentions). */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => Response.json(await listMembers(db, seriesId)));
