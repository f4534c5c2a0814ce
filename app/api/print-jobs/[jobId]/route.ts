// One print job's state and progress, the same from every instance (it is a row).
import { findPrintJob } from '@/db/queries/print-jobs';
import { withSeriesRole } from '@/lib/http/route';
import { byPrintJobId } from '@/lib/http/series-of';

type Params = { jobId: string };

export const GET = withSeriesRole<Params>('read', byPrintJobId, async ({ db, params }) =>
  Response.json({ job: (await findPrintJob(db, params.jobId))! }, { headers: { 'cache-control': 'no-store' } }),
);
