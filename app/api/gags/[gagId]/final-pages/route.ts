// A gag's final pages: the scans of its inked page, newest first, the current one marked;
// an upload (multipart, field "file": TIFF, PNG or JPEG) becomes the current one.
import { listFinalPages } from '@/db/queries/final-pages';
import { pageSpecForGag } from '@/db/queries/series';
import { withSeriesRole } from '@/lib/http/route';
import { byGagId } from '@/lib/http/series-of';
import { finalChanged } from '@/lib/live/events';
import { uploadFinalPage } from '@/lib/uploads/store-final';
import { measureSoon } from '@/lib/export/final-analyses';

type Params = { gagId: string };
const seriesOf = byGagId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) =>
  Response.json(await listFinalPages(db, { gagId: params.gagId })),
);

export const POST = withSeriesRole<Params>('edit', seriesOf, async ({ req, db, params, seriesId, user }) => {
  const spec = await pageSpecForGag(db, seriesId, params.gagId);
  const { page, duplicate } = await uploadFinalPage(req, db, { seriesId, userId: user.id, owner: { gagId: params.gagId }, spec });
  await finalChanged(seriesId, { gagId: params.gagId, entryId: null }, ['gags', 'activity']);
  measureSoon(db, page.id);
  return Response.json(duplicate ? { ...page, duplicate: true } : page, { status: duplicate ? 200 : 201 });
});
