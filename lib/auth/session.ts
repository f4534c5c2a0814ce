// Who is signed in: read from next-auth's session cookie (an encrypted JWT carrying the user id and the session
// id), then checked against the sessions table joined to users, in one query per request: a session that was
// ended (signed out, password changed, removed from the last series) or an account that was deleted is signed out.
// A cookie from before sessions were recorded names no session and is signed out too.
import { LRUCache } from 'lru-cache';
import { type JWT, type JWTDecodeParams, decode, getToken } from 'next-auth/jwt';
import { getDb } from '@/db/client';
import { findSessionUser } from '@/db/queries/sessions';
import { authSecret } from './secret';

export type SessionUser = { id: string; email: string; name: string };

type CookieSource = { getAll(): { name: string; value: string }[] };

function cookiesFromHeader(header: string | null): Record<string, string> {
  const out: Record<string, string> = {};
  for (const part of (header ?? '').split(';')) {
    const i = part.indexOf('=');
    if (i < 0) continue;
    const name = part.slice(0, i).trim();
    const value = part.slice(i + 1).trim();
    try {
      out[name] = decodeURIComponent(value);
    } catch {
      out[name] = value;
    }
  }
  return out;
}

/**
 * next-auth's decode with its answers kept, by the cookie's exact text: opening the encrypted cookie
 * (a key derived from the secret with HKDF, then A256GCM) was work done again on every request for
 * the same answer. Only the decryption is kept — the session is still checked in the database on
 * every request — and an answer past its expiry is decoded again (and so refused). The newest 1,000.
 */
const decoded = new LRUCache<string, JWT>({ max: 1000 });
async function decodeKept(params: JWTDecodeParams): Promise<JWT | null> {
  const key = `${String(params.secret)}\u0000${params.salt ?? ''}\u0000${params.token ?? ''}`;
  const hit = decoded.get(key);
  if (hit && (typeof hit.exp !== 'number' || hit.exp * 1000 > Date.now())) return hit;
  decoded.delete(key);
  const token = await decode(params);
  if (token && params.token) decoded.set(key, token);
  return token;
}

async function tokenFrom(cookies: CookieSource | Record<string, string>, headers: Headers): Promise<JWT | null> {
  const secret = authSecret();
  if (!secret) return null;
  return getToken({
    req: { cookies, headers } as unknown as Parameters<typeof getToken>[0]['req'],
    secret,
    decode: decodeKept,
  });
}

async function userFromCookies(cookies: CookieSource | Record<string, string>, headers: Headers): Promise<SessionUser | null> {
  const token = await tokenFrom(cookies, headers);
  if (!token?.sub || typeof token.sid !== 'string') return null;
  const user = await findSessionUser(await getDb(), token.sid, token.sub);
  return user ?? null;
}

function requestCookies(req: Request): CookieSource | Record<string, string> {
  const maybe = (req as { cookies?: CookieSource }).cookies;
  return maybe && typeof maybe.getAll === 'function' ? maybe : cookiesFromHeader(req.headers.get('cookie'));
}

/** For route handlers: the request carries the cookie. */
export async function userFromRequest(req: Request): Promise<SessionUser | null> {
  return userFromCookies(requestCookies(req), req.headers);
}

/** The session a request's cookie names (read from the cookie alone: check the user with userFromRequest first). */
export async function sessionIdOf(req: Request): Promise<string | null> {
  const token = await tokenFrom(requestCookies(req), req.headers);
  return typeof token?.sid === 'string' ? token.sid : null;
}

/** For server components and server actions. */
export async function currentUser(): Promise<SessionUser | null> {
  const { cookies, headers } = await import('next/headers');
  return userFromCookies(await cookies(), new Headers(await headers()));
}
