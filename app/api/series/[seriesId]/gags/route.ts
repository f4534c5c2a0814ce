import { randomUUID } from 'node:crypto';
import { boardJson, createGag } from '@/db/queries/gags';
import { withSeriesRole } from '@/lib/http/route';
import { createGagSchema } from '@/lib/validation/gag';
import { bySeriesId } from '@/lib/http/series-of';
import { seriesChanged } from '@/lib/live/events';

type Params = { seriesId: string };
const seriesOf = bySeriesId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, seriesId }) => {
  const body = await boardJson(db, seriesId);
  return new Response(new Uint8Array(body.buffer, body.byteOffset, body.byteLength), {
    headers: { 'content-type': 'application/json', 'content-length': String(body.byteLength) },
  });
});

export const POST = withSeriesRole<Params, typeof createGagSchema>(
  'edit',
  seriesOf,
  { body: createGagSchema },
  async ({ db, seriesId, user, body }) => {
    const input = body;
    const gag = await createGag(db, { id: randomUUID(), seriesId, title: input.title, premise: input.premise, createdBy: user.id });
    await seriesChanged(seriesId, ['gags', 'activity'], [gag.id]);
    return Response.json(gag, { status: 201 });
  },
);
