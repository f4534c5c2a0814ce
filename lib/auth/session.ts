// Who is signed in: read from next-auth's session cookie (an encrypted JWT),
// then checked against the users table so a deleted account is signed out.
import { getToken } from 'next-auth/jwt';
import { getDb } from '@/db/client';
import { findUserById } from '@/db/queries/users';
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

async function userFromCookies(cookies: CookieSource | Record<string, string>, headers: Headers): Promise<SessionUser | null> {
  const secret = authSecret();
  if (!secret) return null;
  const token = await getToken({
    req: { cookies, headers } as unknown as Parameters<typeof getToken>[0]['req'],
    secret,
  });
  if (!token?.sub) return null;
  const user = await findUserById(await getDb(), token.sub);
  return user ?? null;
}

/** For route handlers: the request carries the cookie. */
export async function userFromRequest(req: Request): Promise<SessionUser | null> {
  const maybe = (req as { cookies?: CookieSource }).cookies;
  const cookies = maybe && typeof maybe.getAll === 'function' ? maybe : cookiesFromHeader(req.headers.get('cookie'));
  return userFromCookies(cookies, req.headers);
}

/** For server components and server actions. */
export async function currentUser(): Promise<SessionUser | null> {
  const { cookies, headers } = await import('next/headers');
  return userFromCookies(await cookies(), new Headers(await headers()));
}
