// The review dummy as a PDF: every page in running order, vectors, boxes set.
import { reviewPdf } from '@/lib/export/pdf';
import { scanImages, volumePages } from '@/lib/export/volume-export';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

/** `?lightbox=1` draws each page's visible lightbox scans under the strokes. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ req, db, params }) => {
  const lightbox = new URL(req.url).searchParams.get('lightbox');
  if (lightbox !== null && lightbox !== '0' && lightbox !== '1') return jsonError(422, '"lightbox" is 1 (with the scans) or 0 (without).');
  const { volume, pages } = await volumePages(db, params.volumeId, { lightbox: lightbox === '1' });
  const bytes = await reviewPdf(volume.spec, volume.title, pages, { scans: lightbox === '1' ? await scanImages(db, pages) : undefined });
  return new Response(Buffer.from(bytes), {
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(bytes.byteLength),
      'content-disposition': `attachment; filename="${volume.title.replace(/[^A-Za-z0-9 _-]/g, '')}-review.pdf"`,
    },
  });
});
