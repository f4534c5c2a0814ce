/** How many proxies in front of the app append to X-Forwarded-For (TRUST_PROXY; 0 when unset or not a number). */
export function trustedProxyHops(env: Record<string, string | undefined>): number;
/** The key one address is counted under: IPv4 as is, IPv4-mapped IPv6 as IPv4, other IPv6 by its /64. */
export function clientKey(address: string): string;
/** The X-Forwarded-For entry to count with `hops` trusted proxies in front; null for an empty header. */
export function trustedEntry(header: string | null | undefined, hops: number): string | null;
