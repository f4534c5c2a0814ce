// Uploads of scans and photos (multipart, field "file", several allowed).
import { listUploads } from '@/db/queries/uploads';
import { withSeriesRole } from '@/lib/http/route';
import { MAX_UPLOAD_BYTES, prepareUpload } from '@/lib/uploads/process';
import { receiveFile } from '@/lib/uploads/receive';
import { storeUpload } from '@/lib/uploads/store';
import { bySeriesId } from '@/lib/http/series-of';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => Response.json(await listUploads(db, seriesId)));

/** One file per request (field "file") → 201 `{ id, width, height, bytes, sha256 }`; the same file again → 200, stored once. */
// The file streams to a temporary file as it arrives (cut off with 413 past 25 MB), then sharp reads it from disk.
export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ req, db, seriesId, user }) => {
  const file = await receiveFile(req, { field: 'file', maxBytes: MAX_UPLOAD_BYTES });
  try {
    const prepared = await prepareUpload(file.path);
    const { upload, duplicate } = await storeUpload(db, { seriesId, userId: user.id, name: file.name, prepared });
    return duplicate ? Response.json({ ...upload, duplicate: true }, { status: 200 }) : Response.json(upload, { status: 201 });
  } finally {
    await file.discard();
  }
});
