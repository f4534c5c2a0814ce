import { deleteUpload, passesUsingUpload, uploadKeys } from '@/db/queries/uploads';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { deleteObject } from '@/lib/storage/s3';
import { byUploadId } from '@/lib/http/series-of';

type Params = { uploadId: string };
const seriesOf = byUploadId;

/**
 * Co-creators and owners delete an upload and its stored files. An upload a
 * pass still places as its lightbox answers 409 with those passes, unless
 * `?confirm=1` says the person has been asked; the passes then show a
 * "scan deleted" frame where it was.
 */
export const DELETE = withSeriesRole<Params>('edit', seriesOf, async ({ req, db, params }) => {
  const keys = await uploadKeys(db, params.uploadId);
  if (!keys) return jsonError(404, 'Not found.');
  const confirmed = new URL(req.url).searchParams.get('confirm') === '1';
  if (!confirmed) {
    const using = await passesUsingUpload(db, params.uploadId);
    if (using.length) {
      const names = using.map((u) => `pass ${u.passNumber} of “${u.gagTitle}”`).join(', ');
      return Response.json({ error: `This upload is the lightbox of ${names}. Delete it anyway?`, usedBy: using }, { status: 409 });
    }
  }
  await deleteUpload(db, params.uploadId);
  for (const k of [keys.originalKey, keys.workingKey, keys.previewKey]) await deleteObject(k).catch(() => undefined);
  return new Response(null, { status: 204 });
});
