// The print file and the cover file, built as jobs (lib/export/print-jobs.ts): POST starts one
// (or joins the same one under way), GET lists the volume's latest with their progress.
import { listPrintJobs } from '@/db/queries/print-jobs';
import { requestPrintFile } from '@/lib/export/print-jobs';
import { can } from '@/lib/auth/permissions';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { printJobSchema } from '@/lib/validation/volume';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) =>
  Response.json({ jobs: await listPrintJobs(db, params.volumeId) }),
);

export const POST = withSeriesRole<Params, typeof printJobSchema>(
  'print',
  seriesOf,
  { body: printJobSchema },
  async ({ db, params, user, role, body }) => {
    const proof = body.proof ?? false;
    if (proof && !can(role, 'manage')) return jsonError(403, 'Only the owner asks for a proof while pages still lack their scans.');
    const r = await requestPrintFile(db, { volumeId: params.volumeId, kind: body.kind, proof, userId: user.id });
    if (r.blocked) return r.blocked;
    return Response.json({ job: r.job }, { status: 202, headers: { location: `/api/print-jobs/${r.job.id}` } });
  },
);
