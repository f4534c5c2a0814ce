// Drawing templates at 100, 150 or 200 % on A4 or A3.
// Built in a worker thread, like the review dummy.
import { findVolume } from '@/db/queries/volumes';
import { PAPERS, type Paper, templateFits } from '@/lib/export/pdf';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { runHeavy } from '@/lib/workers/pool';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ req, db, params }) => {
  const url = new URL(req.url);
  const scalePct = Number(url.searchParams.get('scale') ?? '100');
  const paper = (url.searchParams.get('paper') ?? 'A4') as Paper;
  if (![100, 150, 200].includes(scalePct)) return jsonError(422, '"scale" is 100, 150 or 200 (percent).');
  if (!(paper in PAPERS)) return jsonError(422, '"paper" is A4 or A3.');
  const volume = (await findVolume(db, params.volumeId))!;
  if (!templateFits(volume.spec, scalePct / 100, paper)) {
    return jsonError(
      422,
      `At ${scalePct}% the page (${volume.spec.trimW} × ${volume.spec.trimH} mm plus bleed) does not fit on ${paper}: choose a smaller scale or a larger paper.`,
    );
  }
  const bytes = await runHeavy('templatesPdf', { volumeId: params.volumeId, scale: scalePct / 100, paper });
  return new Response(Buffer.from(bytes), {
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(bytes.byteLength),
      'content-disposition': `attachment; filename="templates-${scalePct}-${paper}.pdf"`,
    },
  });
});
