// Calls a route handler the way Next does: a Request, a params promise, and
// next-auth's real session cookie (an encrypted JWT made with the app's secret,
// naming a session recorded in the database as a sign-in records it).
import { encode } from 'next-auth/jwt';
import { authSecret } from '@/lib/auth/secret';
import { PERSONAS, type Persona, personaSession } from './test-db';

type Handler = (req: Request, ctx: { params: Promise<any> }) => Promise<Response> | Response;

export async function sessionCookie(persona: Persona): Promise<string | undefined> {
  if (persona === 'anonymous') return undefined;
  const u = PERSONAS[persona];
  return cookieFor({ sub: u.id, email: u.email, name: u.name, sid: await personaSession(persona) });
}

/** A session cookie for any token (e.g. a session a test started itself). */
export async function cookieFor(token: { sub: string; email: string; name: string; sid: string }): Promise<string> {
  return `next-auth.session-token=${await encode({ token, secret: authSecret()! })}`;
}

export async function callRoute(
  handler: Handler,
  opts: { method?: string; url?: string; as?: Persona; params?: Record<string, string>; body?: unknown; rawBody?: string; form?: FormData },
): Promise<{ status: number; body: any }> {
  const headers = new Headers();
  const cookie = await sessionCookie(opts.as ?? 'anonymous');
  if (cookie) headers.set('cookie', cookie);
  let body: string | FormData | undefined;
  if (opts.form) body = opts.form;
  else if (opts.rawBody !== undefined) body = opts.rawBody;
  else if (opts.body !== undefined) body = JSON.stringify(opts.body);
  if (body !== undefined && !opts.form) headers.set('content-type', 'application/json');
  const req = new Request(`http://localhost${opts.url ?? '/'}`, { method: opts.method ?? 'GET', headers, body });
  const res = await handler(req, { params: Promise.resolve(opts.params ?? {}) });
  if ((res.headers.get('content-type') ?? '').startsWith('text/event-stream')) {
    // A live stream never ends by itself: take its first chunk, then hang up as a browser tab would.
    const reader = res.body!.getReader();
    const { value } = await reader.read();
    await reader.cancel();
    return { status: res.status, body: new TextDecoder().decode(value) };
  }
  const text = await res.text();
  const json = (res.headers.get('content-type') ?? '').includes('json');
  return { status: res.status, body: text && json ? JSON.parse(text) : text || null };
}

/** The raw Response, for files (PDF, CSV). */
export async function callRouteRaw(handler: Handler, opts: { url?: string; as?: Persona; params?: Record<string, string> }): Promise<Response> {
  const headers = new Headers();
  const cookie = await sessionCookie(opts.as ?? 'anonymous');
  if (cookie) headers.set('cookie', cookie);
  return handler(new Request(`http://localhost${opts.url ?? '/'}`, { headers }), { params: Promise.resolve(opts.params ?? {}) });
}
