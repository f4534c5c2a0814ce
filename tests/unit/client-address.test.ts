// Which client a sign-in comes from. Next 16 fills in X-Forwarded-For from the socket only when the request has
// none (node_modules/next/dist/server/base-server.js: `req.headers['x-forwarded-for'] ??= socket.remoteAddress`),
// so the trusted entry is the one the outermost of TRUST_PROXY proxies appended.
import { describe, expect, it } from 'vitest';
import { clientAddress, clientKey, trustedProxyHops } from '@/lib/auth/client-address';

const from = (xff: string | undefined, env: Record<string, string> = {}) =>
  clientAddress(new Headers(xff === undefined ? {} : { 'x-forwarded-for': xff }), env);

describe('the client address', () => {
  it('is the address Next wrote from the socket when the client sent none', () => {
    expect(from('203.0.113.7')).toBe('203.0.113.7');
    expect(from(undefined)).toBe('unknown');
  });

  it('behind one proxy (TRUST_PROXY=1) is the entry the proxy appended; what the client wrote before it is ignored', () => {
    // The client claims 1.1.1.1; the proxy appends the address it saw.
    expect(from('1.1.1.1, 203.0.113.7', { TRUST_PROXY: '1' })).toBe('203.0.113.7');
    expect(from('1.1.1.1, 9.9.9.9, 203.0.113.7', { TRUST_PROXY: '1' })).toBe('203.0.113.7');
  });

  it('behind two proxies is the second entry from the right (the outer proxy wrote it)', () => {
    expect(from('1.1.1.1, 203.0.113.7, 10.0.0.2', { TRUST_PROXY: '2' })).toBe('203.0.113.7');
    // A shorter list than the proxies configured: the leftmost there is.
    expect(from('203.0.113.7', { TRUST_PROXY: '2' })).toBe('203.0.113.7');
  });

  it('reads a plain-object header bag (next-auth passes headers that way)', () => {
    expect(clientAddress({ 'x-forwarded-for': '198.51.100.4' }, {})).toBe('198.51.100.4');
  });

  it('TRUST_PROXY: a count of proxies; anything else is 0', () => {
    expect(trustedProxyHops({})).toBe(0);
    expect(trustedProxyHops({ TRUST_PROXY: '1' })).toBe(1);
    expect(trustedProxyHops({ TRUST_PROXY: 'true' })).toBe(1);
    expect(trustedProxyHops({ TRUST_PROXY: '3' })).toBe(3);
    expect(trustedProxyHops({ TRUST_PROXY: 'yes' })).toBe(0);
    expect(trustedProxyHops({ TRUST_PROXY: '-1' })).toBe(0);
  });
});

describe('the key an address is counted under', () => {
  it('IPv4 as is, with a port dropped', () => {
    expect(clientKey('192.0.2.1')).toBe('192.0.2.1');
    expect(clientKey('192.0.2.1:54321')).toBe('192.0.2.1');
  });

  it('IPv4-mapped IPv6 as the IPv4 address (RFC 4291 2.5.5.2), as Node reports dual-stack sockets', () => {
    expect(clientKey('::ffff:192.0.2.1')).toBe('192.0.2.1');
    expect(clientKey('::ffff:c000:201')).toBe('192.0.2.1');
  });

  it('IPv6 by its /64 (RFC 6177: a subscriber usually holds a whole /64 or more)', () => {
    expect(clientKey('2001:db8:1:2:3:4:5:6')).toBe('2001:db8:1:2::/64');
    expect(clientKey('2001:db8:1:2::9')).toBe('2001:db8:1:2::/64');
    expect(clientKey('2001:0db8:0001:0002:ffff::1')).toBe('2001:db8:1:2::/64');
    expect(clientKey('[2001:db8:1:2::9]:443')).toBe('2001:db8:1:2::/64');
    expect(clientKey('fe80::1%eth0')).toBe('fe80:0:0:0::/64');
    expect(clientKey('::1')).toBe('0:0:0:0::/64');
  });

  it('anything that is not an address shares one key', () => {
    expect(clientKey('unknown')).toBe('unknown');
    expect(clientKey('_hidden')).toBe('unknown');
    expect(clientKey('1.2.3.4.5')).toBe('unknown');
  });
});
