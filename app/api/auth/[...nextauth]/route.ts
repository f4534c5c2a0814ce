// next-auth's own endpoints (/api/auth/csrf, /api/auth/callback/credentials, …),
// with one addition: an e-mail address with 10 failed sign-ins in 15 minutes
// gets 429 before its password is even checked.
import NextAuth from 'next-auth';
import { NextRequest } from 'next/server';
import { getDb } from '@/db/client';
import { authOptions } from '@/lib/auth/options';
import { WINDOW_MS, isThrottled } from '@/lib/auth/throttle';
import { readTextCapped } from '@/lib/http/body';
import { Refused } from '@/lib/refused';

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

/** next-auth's forms (sign-in, sign-out, csrf) are a few hundred bytes; nothing larger is read. */
const MAX_AUTH_BODY_BYTES = 8 * 1024;

function emailOf(type: string, text: string): string | null {
  try {
    if (type.includes('application/json')) {
      const body = JSON.parse(text) as { email?: unknown };
      return typeof body.email === 'string' ? body.email : null;
    }
    return new URLSearchParams(text).get('email');
  } catch {
    return null;
  }
}

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(incoming: NextRequest, ctx: Ctx) {
  let text: string;
  try {
    text = await readTextCapped(incoming, MAX_AUTH_BODY_BYTES);
  } catch (err) {
    if (err instanceof Refused) return Response.json({ error: err.message }, { status: err.status });
    throw err;
  }
  // next-auth reads the body itself: hand it the bytes already read, and nothing more.
  const req = new NextRequest(incoming.url, { method: 'POST', headers: incoming.headers, body: text });
  if (req.nextUrl.pathname.endsWith('/callback/credentials')) {
    const email = emailOf(req.headers.get('content-type') ?? '', text)
      ?.trim()
      .toLowerCase();
    if (email && (await isThrottled(await getDb(), email))) {
      const url = new URL('/signin?error=TooManyAttempts', req.nextUrl.origin).toString();
      return Response.json(
        { url, error: 'Too many failed sign-ins for this e-mail address. Wait 15 minutes and try again.' },
        { status: 429, headers: { 'Retry-After': String(WINDOW_MS / 1000) } },
      );
    }
  }
  return handler(req, ctx);
}
