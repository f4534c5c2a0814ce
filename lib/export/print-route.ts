// GET /api/volumes/:volumeId/export/print.pdf and cover.pdf: the job, awaited, then its file.
import 'server-only';
import { printJobFile } from '@/db/queries/print-jobs';
import { findVolume } from '@/db/queries/volumes';
import { can } from '@/lib/auth/permissions';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { pdfFileResponse } from './print-download';
import { requestPrintFile, waitForPrintJob } from './print-jobs';

export function printFileRoute(kind: 'print' | 'cover') {
  return withSeriesRole<{ volumeId: string }>('print', byVolumeId, async ({ req, db, params, user, role }) => {
    const q = new URL(req.url).searchParams.get('proof');
    if (q !== null && q !== '0' && q !== '1') return jsonError(422, '"proof" is 1 (pages without scans stand in, marked) or 0.');
    const proof = q === '1';
    if (proof && !can(role, 'manage')) return jsonError(403, 'Only the owner asks for a proof while pages still lack their scans.');
    const r = await requestPrintFile(db, { volumeId: params.volumeId, kind, proof, userId: user.id });
    if (r.blocked) return r.blocked;
    const job = await waitForPrintJob(db, r.job.id);
    if (job.state === 'failed') return jsonError(500, job.message ?? 'Building the file failed.');
    const file = job.state === 'done' ? await printJobFile(db, job.id) : null;
    if (!file) return jsonError(503, `The file is still being built: follow /api/print-jobs/${job.id}.`, undefined, { 'Retry-After': '30' });
    const volume = (await findVolume(db, params.volumeId))!;
    return (await pdfFileResponse(file.key, volume.title, kind, proof)) ?? jsonError(404, 'The file is gone from storage; build it again.');
  });
}
