// next-auth's own endpoints (/api/auth/csrf, /api/auth/callback/credentials, …),
// with one addition: an e-mail address with 10 failed sign-ins in 15 minutes, or a
// client with 30 failed password checks in 15 minutes, gets 429 before any password
// is checked. (The counts that hold in parallel are taken in authorize, lib/auth/options.ts.)
import NextAuth from 'next-auth';
import { NextRequest } from 'next/server';
import { getDb } from '@/db/client';
import { clientAddress } from '@/lib/auth/client-address';
import { SIGN_IN_REFUSALS, authOptions } from '@/lib/auth/options';
import { WINDOW_MS, isClientThrottled, isThrottled } from '@/lib/auth/throttle';
import { readTextCapped } from '@/lib/http/body';
import { bulkhead } from '@/lib/http/bulkhead';
import { sized } from '@/lib/http/sized';
import { Refused } from '@/lib/refused';
import { email as emailSchema } from '@/lib/validation/account';

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

/** next-auth's forms (sign-in, sign-out, csrf) are a few hundred bytes; nothing larger is read. */
const MAX_AUTH_BODY_BYTES = 8 * 1024;

/** The e-mail address a sign-in names, normalised as the throttle keys it; null when there is none or it is not one. */
function emailOf(type: string, text: string): string | null {
  let raw: unknown;
  try {
    raw = type.includes('application/json') ? (JSON.parse(text) as { email?: unknown }).email : new URLSearchParams(text).get('email');
  } catch {
    return null;
  }
  const parsed = emailSchema.safeParse(raw);
  return parsed.success ? parsed.data : null;
}

function tooMany(req: NextRequest, code: string, error: string): Response {
  const url = new URL(`/signin?error=${code}`, req.nextUrl.origin).toString();
  return Response.json({ url, error }, { status: 429, headers: { 'Retry-After': String(WINDOW_MS / 1000) } });
}

export async function GET(req: NextRequest, ctx: Ctx) {
  return sized(await handler(req, ctx));
}

/**
 * next-auth's forms are handled a few at a time (lib/http/bulkhead.ts): a burst of sign-ins, even ones
 * refused 429 before any password check, costs the event loop a few ms each, and other requests must
 * not wait behind all of them.
 */
const forms = bulkhead({ concurrent: 4, waiting: 256, what: 'sign-ins' });

export async function POST(incoming: NextRequest, ctx: Ctx) {
  try {
    return await sized(await forms.run(() => handleForm(incoming, ctx)));
  } catch (err) {
    if (err instanceof Refused) return sized(Response.json({ error: err.message }, { status: err.status, headers: err.headers }));
    throw err;
  }
}

async function handleForm(incoming: NextRequest, ctx: Ctx) {
  const text = await readTextCapped(incoming, MAX_AUTH_BODY_BYTES);
  if (incoming.nextUrl.pathname.endsWith('/callback/credentials')) {
    const db = await getDb();
    if (await isClientThrottled(db, clientAddress(incoming.headers))) {
      return tooMany(incoming, SIGN_IN_REFUSALS.client, 'Too many failed sign-ins from your network. Wait 15 minutes and try again.');
    }
    const email = emailOf(incoming.headers.get('content-type') ?? '', text);
    if (email && (await isThrottled(db, email))) {
      return tooMany(incoming, SIGN_IN_REFUSALS.address, 'Too many failed sign-ins for this e-mail address. Wait 15 minutes and try again.');
    }
  }
  // next-auth reads the body itself: hand it the bytes already read, and nothing more (a refusal above
  // never builds this second request).
  return handler(new NextRequest(incoming.url, { method: 'POST', headers: incoming.headers, body: text }), ctx);
}
