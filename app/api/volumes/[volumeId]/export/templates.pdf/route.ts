// Blue-line sheets for the drawing desk: per chosen gag, its page at 100, 150 or 200 % on A4 or
// A3 with the approved pass as faint guide lines; a page too big for the paper only when tiled.
// Built in a worker thread, like the review dummy.
import { findVolume } from '@/db/queries/volumes';
import { sheetChoice } from '@/lib/export/volume-export';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { MAX_TILES, fitsOneSheet, sheetCanvas, tiling } from '@/lib/print/sheets';
import { sheetsQuery } from '@/lib/validation/sheets';
import { runHeavy } from '@/lib/workers/pool';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ req, db, params }) => {
  const parsed = sheetsQuery.safeParse(Object.fromEntries(new URL(req.url).searchParams));
  if (!parsed.success) return jsonError(422, parsed.error.issues.map((i) => i.message).join(' '));
  const q = parsed.data;
  const volume = (await findVolume(db, params.volumeId))!;
  const { spec } = volume;
  const fits = fitsOneSheet(spec, q.scale / 100, q.paper);
  const sheets = fits ? 1 : tiling(sheetCanvas(spec, q.scale / 100), q.paper).tiles.length;
  if (!fits && (!q.tile || sheets > MAX_TILES)) {
    const page = `At ${q.scale} % the page (${spec.trimW} × ${spec.trimH} mm plus bleed, with its marks and notes) does not fit on ${q.paper}`;
    return jsonError(
      422,
      sheets > MAX_TILES
        ? `${page}, and tiling it would take ${sheets} sheets a page: choose a smaller scale or a larger paper.`
        : `${page}: choose a smaller scale or a larger paper, or tile it across ${sheets} sheets a page (tile=1).`,
    );
  }
  const choice = await sheetChoice(db, params.volumeId);
  const placed = new Set(choice.gags.map((g) => g.gagId));
  const unknown = (q.gags ?? []).filter((id) => !placed.has(id));
  if (unknown.length) return jsonError(422, `Not a gag in this volume's running order: ${unknown.slice(0, 5).join(', ')}.`);
  const bytes = await runHeavy('templatesPdf', {
    volumeId: params.volumeId,
    gagIds: q.gags ?? choice.defaults,
    scale: q.scale / 100,
    paper: q.paper,
    tiled: !fits,
    colour: q.guide,
    strength: q.strength / 100,
  });
  return new Response(Buffer.from(bytes), {
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(bytes.byteLength),
      'content-disposition': `attachment; filename="blue-lines-${q.scale}-${q.paper}.pdf"`,
    },
  });
});
