// The review dummy as a PDF: every page in running order, vectors, boxes set.
import { reviewPdf } from '@/lib/export/pdf';
import { volumePages } from '@/lib/export/volume-export';
import { withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const { volume, pages } = await volumePages(db, params.volumeId);
  const bytes = await reviewPdf(volume.spec, volume.title, pages);
  return new Response(Buffer.from(bytes), {
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(bytes.byteLength),
      'content-disposition': `attachment; filename="${volume.title.replace(/[^A-Za-z0-9 _-]/g, '')}-review.pdf"`,
    },
  });
});
