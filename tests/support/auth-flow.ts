// Signs in and out through next-auth's own handler with the app's authOptions: the same CSRF check, authorize
// (throttles, password check, rehash), callbacks (the session row) and events (sign-out), without a Next server.
// The route handler in app/api/auth/[...nextauth] reads its request through next/headers, which only works
// inside Next; next-auth's other public entry, `NextAuth(req, res, options)` (the Pages-router API form),
// runs the same core with a plain request and response, so the tests drive that. A `Browser` keeps its cookies
// and says which client address it comes from (X-Forwarded-For, as Next writes it from the socket).
import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';

export const SESSION_COOKIE = 'next-auth.session-token';

export class Browser {
  cookies: Record<string, string> = {};
  constructor(readonly ip?: string) {}

  /** The Cookie header this browser sends now. */
  cookieHeader(): string {
    return Object.entries(this.cookies)
      .map(([k, v]) => `${k}=${v}`)
      .join('; ');
  }

  /** The session cookie alone, e.g. to keep a copy from before a sign-out. */
  sessionCookie(): string | null {
    const v = this.cookies[SESSION_COOKIE];
    return v ? `${SESSION_COOKIE}=${v}` : null;
  }

  /** One request to /api/auth/<path…>; answers the status, the JSON body and what a redirect pointed to. */
  async call(method: 'GET' | 'POST', path: string[], body?: Record<string, string>): Promise<{ status: number; body: any }> {
    const req = {
      method,
      query: { nextauth: path },
      body,
      cookies: { ...this.cookies },
      headers: { host: 'localhost:3000', ...(this.ip ? { 'x-forwarded-for': this.ip } : {}) },
    };
    const out = { status: 200, body: undefined as any, headers: {} as Record<string, string | string[]> };
    const res = {
      status(code: number) {
        out.status = code;
        return res;
      },
      getHeader: (name: string) => out.headers[name.toLowerCase()],
      setHeader(name: string, value: string | string[]) {
        out.headers[name.toLowerCase()] = value;
        return res;
      },
      json(value: unknown) {
        out.body = value;
      },
      send(value: unknown) {
        out.body = value;
      },
      end() {},
    };
    await (NextAuth as unknown as (req: unknown, res: unknown, options: unknown) => Promise<void>)(req, res, authOptions);
    for (const line of ([] as string[]).concat(out.headers['set-cookie'] ?? [])) {
      const [pair, ...attrs] = line.split(';');
      const name = pair!.slice(0, pair!.indexOf('='));
      const value = decodeURIComponent(pair!.slice(pair!.indexOf('=') + 1));
      const gone = value === '' || attrs.some((a) => /^\s*max-age=0\s*$/i.test(a));
      if (gone) delete this.cookies[name];
      else this.cookies[name] = value;
    }
    return out;
  }

  private async csrf(): Promise<string> {
    return (await this.call('GET', ['csrf'])).body.csrfToken;
  }

  /** POST /api/auth/callback/credentials; `error` is next-auth's code (CredentialsSignin, TooManyAttempts, …). */
  async signIn(email: string, password: string): Promise<{ ok: boolean; status: number; error: string | null }> {
    const csrfToken = await this.csrf();
    const res = await this.call('POST', ['callback', 'credentials'], { csrfToken, email, password, json: 'true' });
    const error = res.body?.url ? new URL(res.body.url, 'http://localhost:3000').searchParams.get('error') : 'NoAnswer';
    return { ok: !error && !!this.cookies[SESSION_COOKIE], status: res.status, error };
  }

  /** POST /api/auth/signout, as the sign-out page's button does. */
  async signOut(): Promise<void> {
    const csrfToken = await this.csrf();
    await this.call('POST', ['signout'], { csrfToken, json: 'true' });
  }
}

/** Calls a route handler with exactly this Cookie header (or none). */
export async function callWithCookie(
  handler: (req: Request, ctx: { params: Promise<any> }) => Promise<Response>,
  cookie: string | null,
  opts: { method?: string; body?: unknown; params?: Record<string, string> } = {},
): Promise<{ status: number; body: any }> {
  const headers = new Headers();
  if (cookie) headers.set('cookie', cookie);
  if (opts.body !== undefined) headers.set('content-type', 'application/json');
  const req = new Request('http://localhost/', {
    method: opts.method ?? 'GET',
    headers,
    body: opts.body === undefined ? undefined : JSON.stringify(opts.body),
  });
  const res = await handler(req, { params: Promise.resolve(opts.params ?? {}) });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}
