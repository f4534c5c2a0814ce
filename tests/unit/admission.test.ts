// The front door's admission (server/admission.mjs) on a real HTTP server: password forms go into the
// handler a few at a time, the rest wait before it; past the waiting room the answer is 503 at once; a
// place is given back when an answer ends or its client goes away; other requests are not held.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { admission, clientOf, isCredentialForm } from '@/server/admission.mjs';

type Held = { res: http.ServerResponse; path: string };

let server: http.Server | undefined;
afterEach(async () => {
  const open = server;
  server = undefined;
  if (!open) return;
  open.closeAllConnections();
  await new Promise((r) => open.close(r));
});

/** A server whose handler holds every request until the test answers it. */
async function serve(
  opts: { concurrent: number; waiting: number; perClient?: number; bodyMs?: number },
  fail?: (req: http.IncomingMessage) => unknown,
) {
  // Clients told apart by a header here (the server keys them by address).
  const gate = admission({ ...opts, what: 'sign-ins', keyOf: (req) => String(req.headers['x-client'] ?? 'one') });
  const held: Held[] = [];
  let entered = 0;
  server = http.createServer((req, res) => {
    const handle = () => {
      entered++;
      if (fail) return fail(req);
      if (req.url === '/api/health') res.end('ok');
      else held.push({ res, path: req.url ?? '' });
    };
    if (isCredentialForm(req)) gate.admit(req, res, handle);
    else handle();
  });
  await new Promise<void>((r) => server!.listen(0, '127.0.0.1', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return { gate, held, base, entered: () => entered };
}

const until = async (check: () => boolean) => {
  for (let i = 0; i < 200 && !check(); i++) await new Promise((r) => setTimeout(r, 10));
  expect(check()).toBe(true);
};

describe('admission', () => {
  it('lets password forms in a few at a time and the rest in as places free up', async () => {
    const { gate, held, base } = await serve({ concurrent: 2, waiting: 10 });
    const answers = Array.from({ length: 5 }, (_, i) =>
      fetch(`${base}/api/auth/callback/credentials?n=${i}`, { method: 'POST', body: 'x' }).then((r) => r.text()),
    );
    await until(() => held.length === 2 && gate.pending === 3);
    expect(gate.active).toBe(2);
    // A health check is not held behind them.
    expect(await (await fetch(`${base}/api/health`)).text()).toBe('ok');
    // Answering one lets exactly one more in.
    held.shift()!.res.end('done');
    await until(() => held.length === 2 && gate.pending === 2);
    while (held.length > 0 || gate.pending > 0) {
      await until(() => held.length > 0);
      held.shift()!.res.end('done');
    }
    expect(await Promise.all(answers)).toEqual(Array(5).fill('done'));
    await until(() => gate.active === 0);
  });

  it('answers 503 with Retry-After past its waiting room, without handling the request', async () => {
    const { gate, held, base, entered } = await serve({ concurrent: 1, waiting: 2 });
    const kept = Array.from({ length: 3 }, () => fetch(`${base}/api/users`, { method: 'POST', body: '{}' }));
    await until(() => held.length === 1 && gate.pending === 2);
    const refused = await fetch(`${base}/api/users`, { method: 'POST', body: '{}' });
    expect(refused.status).toBe(503);
    expect(refused.headers.get('retry-after')).toBe('2');
    expect((await refused.json()).error).toMatch(/Too many sign-ins at once/);
    expect(entered()).toBe(1);
    for (let i = 0; i < 3; i++) {
      await until(() => held.length === 1);
      held.shift()!.res.end();
    }
    expect((await Promise.all(kept)).map((r) => r.status)).toEqual([200, 200, 200]);
  });

  it('gives a place back when the client goes away, waiting or inside', async () => {
    const { gate, held, base } = await serve({ concurrent: 1, waiting: 10 });
    const inside = new AbortController();
    const waiting = new AbortController();
    const a = fetch(`${base}/api/auth/signout`, { method: 'POST', body: 'x', signal: inside.signal }).catch(() => 'gone');
    await until(() => held.length === 1);
    const b = fetch(`${base}/api/auth/signout`, { method: 'POST', body: 'x', signal: waiting.signal }).catch(() => 'gone');
    const c = fetch(`${base}/api/auth/callback/credentials`, { method: 'POST', body: 'x' }).then((r) => r.text());
    await until(() => gate.pending === 2);
    waiting.abort();
    inside.abort();
    expect(await a).toBe('gone');
    expect(await b).toBe('gone');
    // The one left standing gets in; the one that left while waiting never reaches the handler.
    await until(() => held.length === 2 && held[1]?.path === '/api/auth/callback/credentials');
    held[1]!.res.end('in');
    expect(await c).toBe('in');
    await until(() => gate.active === 0 && gate.pending === 0);
  });

  it("lets clients in by turns: one client's burst does not keep another's sign-in waiting behind it", async () => {
    const { held, base } = await serve({ concurrent: 1, waiting: 100 });
    const post = (client: string, n: number) =>
      fetch(`${base}/api/auth/callback/credentials?${client}${n}`, { method: 'POST', body: 'x', headers: { 'x-client': client } });
    const first = post('a', 0);
    await until(() => held.length === 1);
    const burst = [1, 2, 3, 4].map((n) => post('a', n));
    await new Promise((r) => setTimeout(r, 50));
    const other = post('b', 0);
    await new Promise((r) => setTimeout(r, 50));
    const order: string[] = [];
    for (let i = 0; i < 6; i++) {
      await until(() => held.length === 1);
      const h = held.shift()!;
      order.push(h.path.split('?')[1]!);
      h.res.end();
    }
    await Promise.all([first, other, ...burst]);
    // b arrived after a's whole burst and is let in right after the one a had inside.
    expect(order).toEqual(['a0', 'a1', 'b0', 'a2', 'a3', 'a4']);
  });

  it("refuses 503 past one client's share of the waiting room, and still lets others wait", async () => {
    const { gate, held, base } = await serve({ concurrent: 1, waiting: 100, perClient: 2 });
    const post = (client: string) => fetch(`${base}/api/users`, { method: 'POST', body: '{}', headers: { 'x-client': client } });
    const kept = [post('a'), post('a'), post('a')];
    await until(() => held.length === 1 && gate.pending === 2);
    expect((await post('a')).status).toBe(503);
    const other = post('b');
    await until(() => gate.pending === 3);
    for (let i = 0; i < 4; i++) {
      await until(() => held.length === 1);
      held.shift()!.res.end();
    }
    expect((await Promise.all([...kept, other])).map((r) => r.status)).toEqual([200, 200, 200, 200]);
  });

  it('forgets a waiting request whose client left, so the waiting room does not fill with the gone', async () => {
    const { gate, held, base } = await serve({ concurrent: 1, waiting: 2 });
    const inside = fetch(`${base}/api/users`, { method: 'POST', body: '{}' });
    await until(() => held.length === 1);
    const leaving = Array.from({ length: 2 }, () => new AbortController());
    const gone = leaving.map((c) => fetch(`${base}/api/users`, { method: 'POST', body: '{}', signal: c.signal }).catch(() => 'gone'));
    await until(() => gate.pending === 2);
    for (const c of leaving) c.abort();
    expect(await Promise.all(gone)).toEqual(['gone', 'gone']);
    await until(() => gate.pending === 0);
    // Room again: a new one waits rather than being refused.
    const next = fetch(`${base}/api/users`, { method: 'POST', body: '{}' });
    await until(() => gate.pending === 1);
    held.shift()!.res.end();
    await until(() => held.length === 1);
    held.shift()!.res.end();
    expect([(await inside).status, (await next).status]).toEqual([200, 200]);
  });

  it('keeps a place until the handler has settled, even when the client hung up first', async () => {
    let finish = () => {};
    const { gate, base } = await serve({ concurrent: 1, waiting: 10 }, () => new Promise<void>((r) => (finish = r)));
    const c = new AbortController();
    const a = fetch(`${base}/api/users`, { method: 'POST', body: '{}', signal: c.signal }).catch(() => 'gone');
    await until(() => gate.active === 1);
    c.abort();
    expect(await a).toBe('gone');
    await new Promise((r) => setTimeout(r, 50));
    expect(gate.active).toBe(1);
    finish();
    await until(() => gate.active === 0);
  });

  it('answers 500 when the handler fails, and gives the place back', async () => {
    const { gate, base } = await serve({ concurrent: 1, waiting: 10 }, () => Promise.reject(new Error('route broke')));
    const res = await fetch(`${base}/api/users`, { method: 'POST', body: '{}' });
    expect(res.status).toBe(500);
    await until(() => gate.active === 0);
  });

  it('answers 408 to a form whose body does not arrive, and gives the place back', async () => {
    // The handler reads the body as Next.js would, and settles when the request closes.
    const { gate, base } = await serve(
      { concurrent: 1, waiting: 10, bodyMs: 200 },
      (req) =>
        new Promise<void>((resolve) => {
          req.on('data', () => {});
          req.on('close', resolve);
        }),
    );
    const url = new URL(base);
    const status = await new Promise<number>((resolve, reject) => {
      const req = http.request(
        { host: url.hostname, port: url.port, path: '/api/users', method: 'POST', headers: { 'content-length': '100' } },
        (res) => resolve(res.statusCode ?? 0),
      );
      req.on('error', reject);
      req.write('{"email":'); // and nothing more
    });
    expect(status).toBe(408);
    await until(() => gate.active === 0);
  });
});

describe('clientOf', () => {
  const req = (xff: string | undefined, remoteAddress = '127.0.0.1') =>
    ({ headers: xff === undefined ? {} : { 'x-forwarded-for': xff }, socket: { remoteAddress } }) as never;
  it('is the socket address when no proxy is trusted, whatever the client wrote', () => {
    expect(clientOf(req('6.6.6.6'), 0)).toBe('127.0.0.1');
  });
  // The /64 as one subscriber's usual allocation: RFC 6177; IPv4-mapped addresses: RFC 4291 §2.5.5.2.
  it('keys as the sign-in limit does: an IPv6 client by its /64, an IPv4-mapped one as IPv4', () => {
    expect(clientOf(req(undefined, '2001:db8:1:2:aaaa::1'), 0)).toBe(clientOf(req(undefined, '2001:db8:1:2:bbbb::9'), 0));
    expect(clientOf(req(undefined, '2001:db8:1:2:aaaa::1'), 0)).toBe('2001:db8:1:2::/64');
    expect(clientOf(req(undefined, '::ffff:127.0.0.1'), 0)).toBe('127.0.0.1');
  });
  it('is the entry the outermost trusted proxy wrote', () => {
    expect(clientOf(req('6.6.6.6, 203.0.113.7'), 1)).toBe('203.0.113.7');
    expect(clientOf(req('6.6.6.6, 203.0.113.7, 10.0.0.2'), 2)).toBe('203.0.113.7');
    expect(clientOf(req(undefined, '10.0.0.2'), 1)).toBe('10.0.0.2');
  });
});

describe('isCredentialForm', () => {
  it.each([
    ['POST', '/api/auth/callback/credentials', true],
    ['POST', '/api/auth/signout?x=1', true],
    ['POST', '/api/users', true],
    ['PATCH', '/api/me', true],
    ['GET', '/api/auth/session', false],
    ['GET', '/api/me', false],
    ['POST', '/api/usersx', false],
    ['POST', '/api/%75sers', true],
    ['PATCH', '/api/m%65', true],
    ['POST', '/api/%zz', false],
    ['POST', '/api/series/s1/gags', false],
  ])('%s %s → %s', (method, url, expected) => {
    expect(isCredentialForm({ method, url })).toBe(expected);
  });
});
