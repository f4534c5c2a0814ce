import { listRevisions, seriesOfPass } from '@/db/queries/passes';
import { withSeriesRole } from '@/lib/http/route';

type Params = { passId: string };
const seriesOf = (p: Params, db: Parameters<typeof seriesOfPass>[0]) => seriesOfPass(db, p.passId);

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) =>
  Response.json(await listRevisions(db, params.passId)),
);
