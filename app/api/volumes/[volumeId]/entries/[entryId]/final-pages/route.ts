// A matter page's final pages (cover, title page, afterword…): as a gag's, on the volume's page.
import { listFinalPages } from '@/db/queries/final-pages';
import { findVolume, matterEntry } from '@/db/queries/volumes';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { finalChanged } from '@/lib/live/events';
import { uploadFinalPage } from '@/lib/uploads/store-final';
import { measureSoon } from '@/lib/export/final-analyses';

type Params = { volumeId: string; entryId: string };
const seriesOf = byVolumeId;

const NOT_MATTER = 'A gag page takes its final page on the gag: POST /api/gags/:gagId/final-pages.';

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => {
  const entry = await matterEntry(db, params.volumeId, params.entryId);
  if (!entry) return jsonError(404, 'Not found.');
  if (entry.kind === 'gag') return jsonError(422, NOT_MATTER);
  return Response.json(await listFinalPages(db, { entryId: params.entryId }));
});

export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ req, db, params, seriesId, user }) => {
  const entry = await matterEntry(db, params.volumeId, params.entryId);
  if (!entry) return jsonError(404, 'Not found.');
  if (entry.kind === 'gag') return jsonError(422, NOT_MATTER);
  const { spec } = (await findVolume(db, params.volumeId))!;
  const { page, duplicate } = await uploadFinalPage(req, db, { seriesId, userId: user.id, owner: { entryId: params.entryId }, spec });
  await finalChanged(seriesId, { gagId: null, entryId: params.entryId });
  measureSoon(db, page.id);
  return Response.json(duplicate ? { ...page, duplicate: true } : page, { status: duplicate ? 200 : 201 });
});
