// Uploads of scans and photos (multipart, field "file", several allowed).
import { listUploads } from '@/db/queries/uploads';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { MAX_UPLOAD_BYTES, prepareUpload } from '@/lib/uploads/process';
import { storeUpload } from '@/lib/uploads/store';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => Response.json(await listUploads(db, seriesId)));

/** One file per request (field "file") → 201 `{ id, width, height, bytes, sha256 }`; the same file again → 200, stored once. */
export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ req, db, seriesId, user }) => {
  const declared = Number(req.headers.get('content-length') ?? 0);
  if (declared > MAX_UPLOAD_BYTES + 64 * 1024) return jsonError(413, 'The file is over 25 MB.');
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    return jsonError(422, 'Send the image as multipart/form-data in a field named "file".');
  }
  const file = form.get('file');
  if (!(file instanceof Blob)) return jsonError(422, 'Send the image in a field named "file".');
  if (file.size > MAX_UPLOAD_BYTES) return jsonError(413, 'The file is over 25 MB.');
  const prepared = await prepareUpload(Buffer.from(await file.arrayBuffer()));
  const name = file instanceof File ? file.name : 'upload';
  const { upload, duplicate } = await storeUpload(db, { seriesId, userId: user.id, name, prepared });
  return duplicate ? Response.json({ ...upload, duplicate: true }, { status: 200 }) : Response.json(upload, { status: 201 });
});
