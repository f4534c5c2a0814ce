import { describe, expect, it } from 'vitest';
import { bulkhead } from '@/lib/http/bulkhead';
import { sized } from '@/lib/http/sized';
import { Refused } from '@/lib/refused';

const tick = () => new Promise((r) => setTimeout(r, 0));

describe('bulkhead', () => {
  it('runs at most `concurrent` at once and the rest in arrival order', async () => {
    const b = bulkhead({ concurrent: 2, waiting: 10, what: 'tests' });
    let running = 0;
    let most = 0;
    const order: number[] = [];
    const release: (() => void)[] = [];
    const jobs = Array.from({ length: 5 }, (_, i) =>
      b.run(async () => {
        running++;
        most = Math.max(most, running);
        order.push(i);
        await new Promise<void>((r) => release.push(r));
        running--;
        return i;
      }),
    );
    await tick();
    expect(b.active).toBe(2);
    expect(b.pending).toBe(3);
    while (order.length < 5 || release.length) {
      release.shift()?.();
      await tick();
    }
    expect(await Promise.all(jobs)).toEqual([0, 1, 2, 3, 4]);
    expect(order).toEqual([0, 1, 2, 3, 4]);
    expect(most).toBe(2);
  });

  it('starts each waiting job on a turn of the event loop of its own, so work that came in meanwhile goes first', async () => {
    // Jobs that finish in microtasks alone (a refusal read from SQLite): a queue of them must not drain in one go
    // while a request that arrived after the first one waits behind all of them.
    const b = bulkhead({ concurrent: 1, waiting: 50, what: 'tests' });
    const order: (number | 'light')[] = [];
    const jobs = Array.from({ length: 20 }, (_, i) =>
      b.run(async () => {
        if (i === 0) setImmediate(() => order.push('light'));
        order.push(i);
      }),
    );
    await Promise.all(jobs);
    await new Promise((r) => setImmediate(r));
    expect(order.indexOf('light')).toBe(1);
    expect(order.filter((x) => x !== 'light')).toEqual(Array.from({ length: 20 }, (_, i) => i));
  });

  it('refuses with 503 and Retry-After once `waiting` are queued, without running the work', async () => {
    const b = bulkhead({ concurrent: 1, waiting: 2, what: 'sign-ins', retryAfterS: 3 });
    let release: (() => void) | undefined;
    const first = b.run(() => new Promise<void>((r) => (release = r)));
    const queued = [b.run(async () => 1), b.run(async () => 2)];
    let ran = false;
    const err = await b
      .run(async () => {
        ran = true;
      })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Refused);
    expect((err as Refused).status).toBe(503);
    expect((err as Refused).headers).toEqual({ 'Retry-After': '3' });
    expect((err as Refused).message).toMatch(/sign-ins/);
    while (!release) await tick(); // the first job starts on the loop's next turn
    release();
    await first;
    expect(await Promise.all(queued)).toEqual([1, 2]);
    expect(ran).toBe(false);
  });
});

describe('sized', () => {
  it('gives a JSON answer its byte length (UTF-8), keeping status and headers', async () => {
    const res = await sized(Response.json({ name: 'Kettle Crab — ✓' }, { status: 429, headers: { 'retry-after': '900' } }));
    const bytes = new TextEncoder().encode(JSON.stringify({ name: 'Kettle Crab — ✓' })).byteLength;
    expect(res.status).toBe(429);
    expect(res.headers.get('content-length')).toBe(String(bytes));
    expect(res.headers.get('retry-after')).toBe('900');
    expect(await res.json()).toEqual({ name: 'Kettle Crab — ✓' });
  });

  it('keeps every Set-Cookie', async () => {
    const headers = new Headers({ 'content-type': 'application/json' });
    headers.append('set-cookie', 'a=1; Path=/');
    headers.append('set-cookie', 'b=2; Path=/');
    const res = await sized(new Response('{}', { headers }));
    expect(res.headers.getSetCookie()).toEqual(['a=1; Path=/', 'b=2; Path=/']);
  });

  it('leaves streams and other types alone', async () => {
    const stream = new Response(new ReadableStream({ start: (c) => c.close() }), { headers: { 'content-type': 'text/event-stream' } });
    expect(await sized(stream)).toBe(stream);
    const svg = new Response('<svg/>', { headers: { 'content-type': 'image/svg+xml' } });
    expect(await sized(svg)).toBe(svg);
  });
});
