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
import { readTextCapped } from './body';
import { sized } from './sized';

export { Refused };

export function jsonError(status: number, message: string, issues?: unknown, headers?: Record<string, string>): Response {
  return Response.json(issues === undefined ? { error: message } : { error: message, issues }, { status, headers });
}

/** A JSON body larger than this is refused unless the route allows more. */
export const DEFAULT_MAX_BODY_BYTES = 64 * 1024;

/** Reads and validates a JSON body: too large → 413 as soon as it passes the limit; malformed or invalid → 422 with the zod issues. */
export async function parseBody<S extends z.ZodType>(req: Request, schema: S, opts: { maxBytes?: number } = {}): Promise<z.infer<S>> {
  let raw: unknown;
  // Only JSON: a form or text/plain body is what a cross-site form would send.
  const type = (req.headers.get('content-type') ?? '').split(';')[0]!.trim().toLowerCase();
  if (type !== 'application/json') throw new Refused(415, 'Send the body as application/json.');
  const text = await readTextCapped(req, opts.maxBytes ?? DEFAULT_MAX_BODY_BYTES);
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
type RouteHandler<P> = (req: Request, context: RouteContext<P>) => Promise<Response>;

/** A route's JSON body: its schema (the wrapper validates it before the handler runs) and size limit. */
export type BodySpec<S extends z.ZodType> = { body: S; maxBytes?: number };
type WithBody<C, S extends z.ZodType> = C & { body: z.infer<S> };

export type UserCtx<P> = { req: Request; params: P; user: SessionUser; db: Kysely<Database> };
export type SeriesCtx<P> = UserCtx<P> & { seriesId: string; role: Role };

/**
 * A change must come from this app's own pages: when the browser says where the
 * request comes from (Origin), it must be this host (as the client reached it) or
 * the configured public address. Reads, and clients that send no Origin, pass.
 */
export function sameSite(req: Request): boolean {
  if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return true;
  const origin = req.headers.get('origin');
  if (!origin) return true;
  let from: string;
  try {
    from = new URL(origin).host;
  } catch {
    return false;
  }
  const hosts = [req.headers.get('x-forwarded-host'), req.headers.get('host'), new URL(req.url).host];
  if (process.env.NEXTAUTH_URL) hosts.push(new URL(process.env.NEXTAUTH_URL).host);
  return hosts.some((h) => h && h.split(',')[0]!.trim() === from);
}

async function run(fn: () => Promise<Response>): Promise<Response> {
  return sized(await answer(fn));
}

async function answer(fn: () => Promise<Response>): Promise<Response> {
  try {
    return await fn();
  } catch (err) {
    if (err instanceof Refused) return jsonError(err.status, err.message, err.issues, err.headers);
    // SQLite busy past its 5 s wait (another process holds the file): try again soon, nothing was written.
    const code = (err as { code?: string } | null)?.code;
    if (code === 'SQLITE_BUSY' || code === 'SQLITE_BUSY_SNAPSHOT') {
      return Response.json(
        { error: 'The database is busy; nothing was changed. Try again in a moment.' },
        { status: 503, headers: { 'Retry-After': '1' } },
      );
    }
    console.error(err);
    return jsonError(500, 'Something went wrong on our side; nothing was changed.');
  }
}

/** Routes open to anyone (sign-up): the same site check, body validation and error answers, no session. */
export function withAnyone<S extends z.ZodType>(
  spec: BodySpec<S>,
  handler: (ctx: { req: Request; body: z.infer<S>; db: Kysely<Database> }) => Promise<Response>,
) {
  return (req: Request) =>
    run(async () => {
      if (!sameSite(req)) return jsonError(403, 'A change from another site is refused.');
      return handler({ req, body: await parseBody(req, spec.body, spec), db: await getDb() });
    });
}

/** Signed-in routes that are not about one series; with a body spec, the body arrives validated. */
export function withUser<P = Record<string, never>>(handler: (ctx: UserCtx<P>) => Promise<Response>): RouteHandler<P>;
export function withUser<P, S extends z.ZodType>(spec: BodySpec<S>, handler: (ctx: WithBody<UserCtx<P>, S>) => Promise<Response>): RouteHandler<P>;
export function withUser<P, S extends z.ZodType>(
  a: BodySpec<S> | ((ctx: UserCtx<P>) => Promise<Response>),
  b?: (ctx: WithBody<UserCtx<P>, S>) => Promise<Response>,
): RouteHandler<P> {
  const spec = typeof a === 'function' ? null : a;
  const handler = (typeof a === 'function' ? a : b!) as (ctx: UserCtx<P> & { body?: unknown }) => Promise<Response>;
  return (req: Request, context: RouteContext<P>) =>
    run(async () => {
      if (!sameSite(req)) return jsonError(403, 'A change from another site is refused.');
      const user = await userFromRequest(req);
      if (!user) return jsonError(401, 'Sign in first.');
      const params = (await context?.params) ?? ({} as P);
      const ctx = { req, params, user, db: await getDb() };
      return spec ? handler({ ...ctx, body: await parseBody(req, spec.body, spec) }) : handler(ctx);
    });
}

/**
 * Routes about one series. `seriesOf` finds the series a resource belongs to
 * (null when the resource does not exist, which answers 404 like a non-member).
 */
type SeriesOf<P> = (params: P, db: Kysely<Database>) => Promise<string | null>;

export function withSeriesRole<P>(action: Action, seriesOf: SeriesOf<P>, handler: (ctx: SeriesCtx<P>) => Promise<Response>): RouteHandler<P>;
export function withSeriesRole<P, S extends z.ZodType>(
  action: Action,
  seriesOf: SeriesOf<P>,
  spec: BodySpec<S>,
  handler: (ctx: WithBody<SeriesCtx<P>, S>) => Promise<Response>,
): RouteHandler<P>;
export function withSeriesRole<P, S extends z.ZodType>(
  action: Action,
  seriesOf: SeriesOf<P>,
  a: BodySpec<S> | ((ctx: SeriesCtx<P>) => Promise<Response>),
  b?: (ctx: WithBody<SeriesCtx<P>, S>) => Promise<Response>,
): RouteHandler<P> {
  const spec = typeof a === 'function' ? null : a;
  const handler = (typeof a === 'function' ? a : b!) as (ctx: SeriesCtx<P> & { body?: unknown }) => Promise<Response>;
  return withUser<P>(async (ctx) => {
    const seriesId = await seriesOf(ctx.params, ctx.db);
    if (!seriesId) return jsonError(404, 'Not found.');
    const access = await authorizeSeries(ctx.user.id, seriesId, action);
    if (!access.ok) return jsonError(access.status, access.message);
    // The body is read only after the role check: a refused caller never gets a parser's attention.
    const sctx = { ...ctx, seriesId, role: access.role };
    return spec ? handler({ ...sctx, body: await parseBody(ctx.req, spec.body, spec) }) : handler(sctx);
  });
}
