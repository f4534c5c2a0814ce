import { randomUUID } from 'node:crypto';
import { createSeries, listSeriesForUser } from '@/db/queries/series';
import { withUser } from '@/lib/http/route';
import { createSeriesSchema } from '@/lib/validation/series';

/** The series I belong to, with my role in each. */
export const GET = withUser(async ({ user, db }) => Response.json(await listSeriesForUser(db, user.id)));

/** Creates a series; the creator becomes its owner. */
export const POST = withUser<Record<string, never>, typeof createSeriesSchema>({ body: createSeriesSchema }, async ({ body, user, db }) => {
  const series = await createSeries(db, { id: randomUUID(), title: body.title, ownerId: user.id });
  return Response.json(series, { status: 201 });
});
