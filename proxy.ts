// Runs before every page (not the API, not static files): gives the page a
// fresh CSP nonce and its Content-Security-Policy (lib/http/csp.ts).
import { type NextRequest, NextResponse } from 'next/server';
import { newNonce, pagePolicy } from '@/lib/http/csp';

export function proxy(request: NextRequest) {
  const nonce = newNonce();
  const policy = pagePolicy(nonce);
  const headers = new Headers(request.headers);
  headers.set('x-nonce', nonce);
  headers.set('content-security-policy', policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set('content-security-policy', policy);
  return response;
}

export const config = {
  matcher: [
    {
      source: '/((?!api/|_next/static|_next/image|icon.svg|favicon.ico).*)',
      missing: [
        { type: 'header', key: 'next-router-prefetch' },
        { type: 'header', key: 'purpose', value: 'prefetch' },
      ],
    },
  ],
};
