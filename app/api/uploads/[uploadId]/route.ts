import { deleteUpload, uploadKeys } from '@/db/queries/uploads';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { deleteObject } from '@/lib/storage/s3';
import { byUploadId } from '@/lib/http/series-of';

type Params = { uploadId: string };
const seriesOf = byUploadId;

/** Co-creators and owners delete an upload and its stored files. */
export const DELETE = withSeriesRole<Params>('edit', seriesOf, async ({ db, params }) => {
  const keys = await uploadKeys(db, params.uploadId);
  if (!keys) return jsonError(404, 'Not found.');
  await deleteUpload(db, params.uploadId);
  for (const k of [keys.originalKey, keys.workingKey, keys.previewKey]) await deleteObject(k).catch(() => undefined);
  return new Response(null, { status: 204 });
});
