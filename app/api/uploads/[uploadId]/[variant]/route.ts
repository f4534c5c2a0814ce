// The image bytes, only to members of its series (never a public URL), streamed from storage.
import { uploadKeys } from '@/db/queries/uploads';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { objectResponse } from '@/lib/storage/s3';
import { byUploadId } from '@/lib/http/series-of';

type Params = { uploadId: string; variant: string };
const seriesOf = byUploadId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const keys = await uploadKeys(db, params.uploadId);
  const key =
    params.variant === 'original'
      ? keys?.originalKey
      : params.variant === 'working'
        ? keys?.workingKey
        : params.variant === 'preview'
          ? keys?.previewKey
          : undefined;
  if (!keys || !key) return jsonError(404, 'Not found: the variants are original, working and preview.');
  return (await objectResponse(key)) ?? jsonError(404, 'Not found.');
});
