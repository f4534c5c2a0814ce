// Route handler wrappers. Every handler runs in one order:
// session (401) → series membership (404) and role (403) → body validation (422)
// → the handler's own work. Using these wrappers makes skipping a check impossible.
// A `Refused` thrown anywhere below (a query, a service) becomes its JSON answer here.
import type { Kysely } from 'kysely';
import type { z } from 'zod';
import { getDb } from '@/db/client';
import type { Database } from '@/db/database';
import { authorizeSeries } from '@/lib/auth/guard';
import type { Action, Role } from '@/lib/auth/permissions';
import { type SessionUser, userFromRequest } from '@/lib/auth/session';
import { Refused } from '@/lib/refused';

export { Refused };

export function jsonError(status: number, message: string, issues?: unknown): Response {
  return Response.json(issues === undefined ? { error: message } : { error: message, issues }, { status });
}

/** Reads and validates a JSON body; malformed or invalid → 422 with the zod issues. */
export async function parseBody<S extends z.ZodType>(req: Request, schema: S, opts: { maxBytes?: number } = {}): Promise<z.infer<S>> {
  let raw: unknown;
  const text = await req.text();
  if (opts.maxBytes !== undefined && Buffer.byteLength(text) > opts.maxBytes) {
    throw new Refused(422, `The body is over ${opts.maxBytes.toLocaleString('en')} bytes; send it in smaller batches.`);
  }
  try {
    raw = JSON.parse(text);
  } catch {
    throw new Refused(422, 'The body must be JSON.');
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    throw new Refused(
      422,
      parsed.error.issues.map((i) => i.message).join(' '),
      parsed.error.issues.map((i) => ({ path: i.path, message: i.message, code: i.code })),
    );
  }
  return parsed.data;
}

type RouteContext<P> = { params: Promise<P> };

export type UserCtx<P> = { req: Request; params: P; user: SessionUser; db: Kysely<Database> };
export type SeriesCtx<P> = UserCtx<P> & { seriesId: string; role: Role };

async function run(fn: () => Promise<Response>): Promise<Response> {
  try {
    return await fn();
  } catch (err) {
    if (err instanceof Refused) return jsonError(err.status, err.message, err.issues);
    console.error(err);
    return jsonError(500, 'Something went wrong on our side; nothing was changed.');
  }
}

/** Signed-in routes that are not about one series. */
export function withUser<P = Record<string, never>>(handler: (ctx: UserCtx<P>) => Promise<Response>) {
  return (req: Request, context: RouteContext<P>) =>
    run(async () => {
      const user = await userFromRequest(req);
      if (!user) return jsonError(401, 'Sign in first.');
      const params = (await context?.params) ?? ({} as P);
      return handler({ req, params, user, db: await getDb() });
    });
}

/**
 * Routes about one series. `seriesOf` finds the series a resource belongs to
 * (null when the resource does not exist, which answers 404 like a non-member).
 */
export function withSeriesRole<P>(
  action: Action,
  seriesOf: (params: P, db: Kysely<Database>) => Promise<string | null>,
  handler: (ctx: SeriesCtx<P>) => Promise<Response>,
) {
  return withUser<P>(async (ctx) => {
    const seriesId = await seriesOf(ctx.params, ctx.db);
    if (!seriesId) return jsonError(404, 'Not found.');
    const access = await authorizeSeries(ctx.user.id, seriesId, action);
    if (!access.ok) return jsonError(access.status, access.message);
    return handler({ ...ctx, seriesId, role: access.role });
  });
}
