// @ts-check
// The client key of an address, and which X-Forwarded-For entry to trust: plain JavaScript, so both the app
// (lib/auth/client-address.ts, for the per-client sign-in limit) and the front door in front of Next.js
// (server/admission.mjs, for whose turn a waiting sign-in is) count a client the same way. See
// lib/auth/client-address.ts for how the address reaches the app and why.
import { isIPv4, isIPv6 } from 'node:net';

/**
 * How many proxies in front of the app append to X-Forwarded-For (TRUST_PROXY; 0 when unset or not a number).
 * @param {Record<string, string | undefined>} env
 */
export function trustedProxyHops(env) {
  const raw = (env.TRUST_PROXY ?? '').trim().toLowerCase();
  if (raw === 'true') return 1;
  const n = Number(raw);
  return Number.isInteger(n) && n > 0 && n < 32 ? n : 0;
}

/**
 * Expands an IPv6 address to its eight groups; null when it is not one.
 * @param {string} address
 * @returns {number[] | null}
 */
function ipv6Groups(address) {
  let text = address;
  /** @type {number[]} */
  let tail = [];
  const v4 = /(\d+\.\d+\.\d+\.\d+)$/.exec(text);
  if (v4) {
    const [a, b, c, d] = /** @type {[number, number, number, number]} */ (/** @type {string} */ (v4[1]).split('.').map(Number));
    tail = [(a << 8) | b, (c << 8) | d];
    text = text.slice(0, -(/** @type {string} */ (v4[1]).length)) + '0:0';
  }
  const [head, rest] = text.split('::');
  /** @param {string} s */
  const part = (s) => (s ? s.split(':').map((g) => parseInt(g, 16)) : []);
  const left = part(head ?? '');
  const right = part(rest ?? '');
  const groups = rest === undefined ? left : [...left, ...Array(8 - left.length - right.length).fill(0), ...right];
  if (groups.length !== 8 || groups.some((g) => !Number.isInteger(g) || g < 0 || g > 0xffff)) return null;
  if (tail.length) groups.splice(6, 2, ...tail);
  return groups;
}

/**
 * The key one address is counted under: IPv4 as is, IPv4-mapped IPv6 as IPv4, other IPv6 by its /64.
 * @param {string} address
 */
export function clientKey(address) {
  let a = address.trim();
  if (a.startsWith('['))
    a = a.slice(1, a.indexOf(']') > 0 ? a.indexOf(']') : undefined); // [v6]:port
  else if (/^\d+\.\d+\.\d+\.\d+:\d+$/.test(a)) a = a.slice(0, a.lastIndexOf(':')); // v4:port
  a = a.replace(/%.*$/, ''); // zone id
  if (isIPv4(a)) return a;
  if (isIPv6(a)) {
    const g = ipv6Groups(a);
    if (!g) return 'unknown';
    const at = (/** @type {number} */ i) => /** @type {number} */ (g[i]);
    if (g.slice(0, 5).every((x) => x === 0) && at(5) === 0xffff) return `${at(6) >> 8}.${at(6) & 255}.${at(7) >> 8}.${at(7) & 255}`;
    return `${g
      .slice(0, 4)
      .map((x) => x.toString(16))
      .join(':')}::/64`;
  }
  // Not an address (RFC 7239 "unknown", an obfuscated name, garbage): all such share one key.
  return 'unknown';
}

/**
 * The X-Forwarded-For entry to count: with N trusted proxies the one the outermost of them wrote (a shorter list
 * means a proxy left none: the leftmost there is); with none, the last. Null for an empty header.
 * @param {string | null | undefined} header
 * @param {number} hops
 */
export function trustedEntry(header, hops) {
  const entries = (header ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  if (entries.length === 0) return null;
  return /** @type {string} */ (hops === 0 ? entries[entries.length - 1] : entries[Math.max(0, entries.length - hops)]);
}
