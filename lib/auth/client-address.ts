// Which client a request comes from, for the per-client sign-in limit.
//
// How the address reaches a route handler under `next start` (Next 16, node_modules/next/dist/server/base-server.js,
// handleRequestImpl): Next writes `x-forwarded-for` from the socket's remote address ONLY when the request has no
// such header (`req.headers['x-forwarded-for'] ??= socket.remoteAddress`); a header the client sent is passed on
// untouched, and a route handler has no other view of the socket. So:
// - TRUST_PROXY unset or 0 (the app reached directly): the last entry is the socket address when the client sent
//   none, but a client that writes its own X-Forwarded-For picks its own key. The per-address limit still holds;
//   the per-client one only stops clients that do not lie.
// - TRUST_PROXY=N (N proxies in front, each appending the address it saw, as nginx's $proxy_add_x_forwarded_for,
//   HAProxy's `option forwardfor` and cloud load balancers do): the N-th entry from the right was written by our
//   outermost proxy and cannot be forged; entries left of it are the client's own claims and are ignored.
// Addresses are keyed as IPv4, or as the IPv6 /64 (one subscriber's usual allocation, RFC 6177), so a client
// cannot step through its own /64 to get fresh attempts. The keying itself is lib/auth/client-key.mjs, shared
// with the front door (server/admission.mjs).
import { clientKey, trustedEntry, trustedProxyHops as hopsIn } from './client-key.mjs';

export { clientKey };

type HeaderSource = Headers | Record<string, string | string[] | undefined>;

function header(headers: HeaderSource, name: string): string | null {
  if (typeof (headers as Headers).get === 'function') return (headers as Headers).get(name);
  const v = (headers as Record<string, string | string[] | undefined>)[name];
  return Array.isArray(v) ? v.join(', ') : (v ?? null);
}

/** How many proxies in front of the app append to X-Forwarded-For (TRUST_PROXY; 0 when unset or not a number). */
export function trustedProxyHops(env: Record<string, string | undefined> = process.env): number {
  return hopsIn(env);
}

/** The client a request comes from, as its counting key (see the top of this file). */
export function clientAddress(headers: HeaderSource, env: Record<string, string | undefined> = process.env): string {
  const entry = trustedEntry(header(headers, 'x-forwarded-for'), hopsIn(env));
  return entry === null ? 'unknown' : clientKey(entry);
}
