// The review dummy as a PDF: every page in running order, vectors, boxes set.
// Built in a worker thread: a long volume takes seconds and must not hold up other requests.
import { findVolume } from '@/db/queries/volumes';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { runHeavy } from '@/lib/workers/pool';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

/** `?lightbox=1` draws each page's visible lightbox scans under the strokes. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ req, db, params }) => {
  const lightbox = new URL(req.url).searchParams.get('lightbox');
  if (lightbox !== null && lightbox !== '0' && lightbox !== '1') return jsonError(422, '"lightbox" is 1 (with the scans) or 0 (without).');
  const volume = (await findVolume(db, params.volumeId))!;
  const bytes = await runHeavy('reviewPdf', { volumeId: params.volumeId, lightbox: lightbox === '1' });
  return new Response(Buffer.from(bytes), {
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(bytes.byteLength),
      'content-disposition': `attachment; filename="${volume.title.replace(/[^A-Za-z0-9 _-]/g, '')}-review.pdf"`,
    },
  });
});
