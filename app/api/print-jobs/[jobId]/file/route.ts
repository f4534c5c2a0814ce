// A finished print job's file, streamed from object storage to members of the series.
import { findPrintJob, printJobFile } from '@/db/queries/print-jobs';
import { findVolume } from '@/db/queries/volumes';
import { pdfFileResponse } from '@/lib/export/print-download';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byPrintJobId } from '@/lib/http/series-of';

type Params = { jobId: string };

export const GET = withSeriesRole<Params>('read', byPrintJobId, async ({ db, params }) => {
  const file = await printJobFile(db, params.jobId);
  if (!file) {
    if ((await findPrintJob(db, params.jobId))?.state === 'done') return jsonError(410, 'This file was replaced by a newer one; download that.');
    return jsonError(409, 'The file is not ready: the job is still running, or it failed.');
  }
  const volume = (await findVolume(db, file.volumeId))!;
  return (await pdfFileResponse(file.key, volume.title, file.kind, file.proof)) ?? jsonError(404, 'The file is gone from storage; build it again.');
});
