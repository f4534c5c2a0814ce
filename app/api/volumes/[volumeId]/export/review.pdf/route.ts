// The review dummy as a PDF: every page in running order, vectors, boxes set.
import { seriesOfVolume } from '@/db/queries/volumes';
import { reviewPdf } from '@/lib/export/pdf';
import { volumePages } from '@/lib/export/volume-export';
import { withSeriesRole } from '@/lib/http/route';

type Params = { volumeId: string };
const seriesOf = (p: Params, db: Parameters<typeof seriesOfVolume>[0]) => seriesOfVolume(db, p.volumeId);

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
