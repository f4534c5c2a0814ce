// next-auth's own endpoints (/api/auth/csrf, /api/auth/callback/credentials, …),
// with one addition: an e-mail address with 10 failed sign-ins in 15 minutes
// gets 429 before its password is even checked.
import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { getDb } from '@/db/client';
import { authOptions } from '@/lib/auth/options';
import { WINDOW_MS, isThrottled } from '@/lib/auth/throttle';

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

async function emailOf(req: NextRequest): Promise<string | null> {
  try {
    const type = req.headers.get('content-type') ?? '';
    if (type.includes('application/json')) {
      const body = (await req.clone().json()) as { email?: unknown };
      return typeof body.email === 'string' ? body.email : null;
    }
    const form = await req.clone().formData();
    const email = form.get('email');
    return typeof email === 'string' ? email : null;
  } catch {
    return null;
  }
}

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(req: NextRequest, ctx: Ctx) {
  if (req.nextUrl.pathname.endsWith('/callback/credentials')) {
    const email = (await emailOf(req))?.trim().toLowerCase();
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
