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
// cannot step through its own /64 to get fresh attempts.
import { isIPv4, isIPv6 } from 'node:net';

type HeaderSource = Headers | Record<string, string | string[] | undefined>;

function header(headers: HeaderSource, name: string): string | null {
  if (typeof (headers as Headers).get === 'function') return (headers as Headers).get(name);
  const v = (headers as Record<string, string | string[] | undefined>)[name];
  return Array.isArray(v) ? v.join(', ') : (v ?? null);
}

/** How many proxies in front of the app append to X-Forwarded-For (TRUST_PROXY; 0 when unset or not a number). */
export function trustedProxyHops(env: Record<string, string | undefined> = process.env): number {
  const raw = (env.TRUST_PROXY ?? '').trim().toLowerCase();
  if (raw === 'true') return 1;
  const n = Number(raw);
  return Number.isInteger(n) && n > 0 && n < 32 ? n : 0;
}

/** Expands an IPv6 address to its eight groups; null when it is not one. */
function ipv6Groups(address: string): number[] | null {
  let text = address;
  let tail: number[] = [];
  const v4 = /(\d+\.\d+\.\d+\.\d+)$/.exec(text);
  if (v4) {
    const [a, b, c, d] = v4[1]!.split('.').map(Number) as [number, number, number, number];
    tail = [(a << 8) | b, (c << 8) | d];
    text = text.slice(0, -v4[1]!.length) + '0:0';
  }
  const [head, rest] = text.split('::') as [string, string | undefined];
  const part = (s: string) => (s ? s.split(':').map((g) => parseInt(g, 16)) : []);
  const left = part(head);
  const right = part(rest ?? '');
  const groups = rest === undefined ? left : [...left, ...Array(8 - left.length - right.length).fill(0), ...right];
  if (groups.length !== 8 || groups.some((g) => !Number.isInteger(g) || g < 0 || g > 0xffff)) return null;
  if (tail.length) groups.splice(6, 2, ...tail);
  return groups;
}

/** The key one address is counted under: IPv4 as is, IPv4-mapped IPv6 as IPv4, other IPv6 by its /64. */
export function clientKey(address: string): string {
  let a = address.trim();
  if (a.startsWith('['))
    a = a.slice(1, a.indexOf(']') > 0 ? a.indexOf(']') : undefined); // [v6]:port
  else if (/^\d+\.\d+\.\d+\.\d+:\d+$/.test(a)) a = a.slice(0, a.lastIndexOf(':')); // v4:port
  a = a.replace(/%.*$/, ''); // zone id
  if (isIPv4(a)) return a;
  if (isIPv6(a)) {
    const g = ipv6Groups(a);
    if (!g) return 'unknown';
    if (g.slice(0, 5).every((x) => x === 0) && g[5] === 0xffff) return `${g[6]! >> 8}.${g[6]! & 255}.${g[7]! >> 8}.${g[7]! & 255}`;
    return `${g
      .slice(0, 4)
      .map((x) => x.toString(16))
      .join(':')}::/64`;
  }
  // Not an address (RFC 7239 "unknown", an obfuscated name, garbage): all such share one key.
  return 'unknown';
}

/** The client a request comes from, as its counting key (see the top of this file). */
export function clientAddress(headers: HeaderSource, env: Record<string, string | undefined> = process.env): string {
  const entries = (header(headers, 'x-forwarded-for') ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  if (entries.length === 0) return 'unknown';
  const hops = trustedProxyHops(env);
  // With N trusted proxies, the entry our outermost proxy wrote; a shorter list means a proxy left none.
  const entry = hops === 0 ? entries[entries.length - 1]! : entries[Math.max(0, entries.length - hops)]!;
  return clientKey(entry);
}
