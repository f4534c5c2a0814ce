// Oversized bodies are refused while they arrive: the server stops reading a
// JSON body, a sign-in form or an upload as soon as it passes the route's
// limit, with or without a Content-Length, so neither the time nor the memory
// to take in the rest is spent. The bodies here are produced lazily and count
// how much of them the server pulled (a stream reads one chunk ahead, hence
// the allowance of two chunks).
import { describe, expect, it } from 'vitest';
import * as authRoute from '@/app/api/auth/[...nextauth]/route';
import * as gagsRoute from '@/app/api/series/[seriesId]/gags/route';
import * as uploadsRoute from '@/app/api/series/[seriesId]/uploads/route';
import * as usersRoute from '@/app/api/users/route';
import { DEFAULT_MAX_BODY_BYTES } from '@/lib/http/route';
import { MAX_UPLOAD_BYTES } from '@/lib/uploads/process';
import { sessionCookie } from '../support/call-route';
import { useS3AndDb } from '../support/s3-fake';
import { DEMO_SERIES_ID, countRows } from '../support/test-db';

const env = useS3AndDb();

const CHUNK = 64 * 1024;

/** A body of `total` bytes made on demand, 64 KB at a time; `pulled()` says how much the reader took. */
function lazyBody(total: number, head = '', fill = 0x20) {
  let sent = 0;
  const first = new TextEncoder().encode(head);
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= total) return controller.close();
      const size = Math.min(CHUNK, total - sent);
      const chunk = new Uint8Array(size).fill(fill);
      if (sent === 0) chunk.set(first.subarray(0, size));
      sent += size;
      controller.enqueue(chunk);
    },
  });
  return { stream, pulled: () => sent };
}

function request(url: string, body: ReadableStream<Uint8Array>, headers: Record<string, string>) {
  return new Request(`http://localhost${url}`, { method: 'POST', body, headers, duplex: 'half' } as RequestInit);
}

describe('bodies over their limit', () => {
  it('a JSON body without Content-Length is cut off just past the limit (413), the rest never read', async () => {
    const body = lazyBody(300 * 1024 * 1024, '{"name":"');
    const res = await usersRoute.POST(request('/api/users', body.stream, { 'content-type': 'application/json' }));
    expect(res.status).toBe(413);
    expect((await res.json()).error).toMatch(/over 65,536 bytes/);
    expect(body.pulled()).toBeLessThanOrEqual(DEFAULT_MAX_BODY_BYTES + 2 * CHUNK);
  });

  it('a declared Content-Length over the limit is refused before any of the body is read', async () => {
    const body = lazyBody(300 * 1024 * 1024, '{"title":"');
    const cookie = (await sessionCookie('cocreator'))!;
    const res = await gagsRoute.POST(
      request('/api/series/x/gags', body.stream, { 'content-type': 'application/json', 'content-length': String(300 * 1024 * 1024), cookie }),
      { params: Promise.resolve({ seriesId: DEMO_SERIES_ID }) },
    );
    expect(res.status).toBe(413);
    expect(body.pulled()).toBeLessThanOrEqual(CHUNK);
  });

  it('a sign-in form of 400 MB is refused after 8 KB; nothing reaches the password check', async () => {
    const body = lazyBody(400 * 1024 * 1024, 'email=crab%40example.test&password=');
    const before = await countRows(env.db(), ['signInFailures']);
    const res = await authRoute.POST(
      request('/api/auth/callback/credentials', body.stream, { 'content-type': 'application/x-www-form-urlencoded' }) as never,
      {
        params: Promise.resolve({ nextauth: ['callback', 'credentials'] }),
      },
    );
    expect(res.status).toBe(413);
    expect(body.pulled()).toBeLessThanOrEqual(8 * 1024 + 2 * CHUNK);
    expect(await countRows(env.db(), ['signInFailures'])).toEqual(before);
  });

  it('an upload streamed without Content-Length is cut off just past 25 MB and stores nothing', async () => {
    const boundary = 'kettlecrabboundary';
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="pier.png"\r\nContent-Type: image/png\r\n\r\n`;
    const body = lazyBody(800 * 1024 * 1024, head, 0x41);
    const cookie = (await sessionCookie('cocreator'))!;
    const uploads = await countRows(env.db(), ['uploads']);
    const res = await uploadsRoute.POST(request('/x', body.stream, { 'content-type': `multipart/form-data; boundary=${boundary}`, cookie }), {
      params: Promise.resolve({ seriesId: DEMO_SERIES_ID }),
    });
    expect(res.status).toBe(413);
    expect((await res.json()).error).toBe('The file is over 25 MB.');
    expect(body.pulled()).toBeLessThanOrEqual(MAX_UPLOAD_BYTES + 4 * CHUNK);
    expect(await countRows(env.db(), ['uploads'])).toEqual(uploads);
  });

  it('an upload declared over 25 MB is refused before its body is read', async () => {
    const body = lazyBody(800 * 1024 * 1024, '', 0x41);
    const cookie = (await sessionCookie('cocreator'))!;
    const res = await uploadsRoute.POST(
      request('/x', body.stream, { 'content-type': 'multipart/form-data; boundary=b', 'content-length': String(800 * 1024 * 1024), cookie }),
      { params: Promise.resolve({ seriesId: DEMO_SERIES_ID }) },
    );
    expect(res.status).toBe(413);
    expect(body.pulled()).toBeLessThanOrEqual(CHUNK);
  });

  it('a body just under the limit is still read and judged on its content', async () => {
    const text = JSON.stringify({ name: 'Kettle', email: 'big@example.test', password: 'x'.repeat(DEFAULT_MAX_BODY_BYTES - 100) });
    const res = await usersRoute.POST(
      new Request('http://localhost/api/users', { method: 'POST', body: text, headers: { 'content-type': 'application/json' } }),
    );
    expect(res.status).toBe(422);
  });
});
