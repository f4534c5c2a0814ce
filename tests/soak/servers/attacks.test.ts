// The attacks of issue 13 that need a real server (`server/main.mjs`) (one process on a seeded SQLite file):
// - bodies over their route's limit (found 1; OWASP ASVS 4.0 V12.1.1 file size, V13.1 API): declared with a
//   Content-Length or streamed chunked without one, each gets 413 within 1 s of the bytes crossing the limit
//   while the server's memory grows by less than 50 MB (100 MB is streamed at most, so a server that buffered
//   the body would show it);
// - wrong passwords for one address all at once (found 2; ASVS V2.2.1 anti-automation): at most 10 reach the
//   password check, every other one is answered 429 with Retry-After, and a right password arriving after the
//   limit does not sign in;
// - six identical uploads at once (found 4): stored once, one 201 and five 200 duplicates of it, never a 500
//   from the unique constraint the racing requests meet.
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_SERIES_ID } from '@/db/seed/demo-data';
import type { Instance } from '../../support/instances';
import { MB, type SqliteSite, csrfOf, mustSignIn, sendOversized, signIn, sqliteSite } from '../../support/servers';
import { recordFigures } from '../../support/soak';

const TOTAL = 100 * MB;
const MAX_MS_AFTER_LIMIT = 1000;
const MAX_RSS_GROWTH = 50 * MB;
const JSON_LIMIT = 64 * 1024;
const BATCH_LIMIT = 1024 * 1024;
// A sign-in form is a few hundred bytes: whatever its limit, it is no more than a JSON route's.
const SIGN_IN_LIMIT = 64 * 1024;
// 25 MB for the file, and room for the multipart headers around it.
const UPLOAD_LIMIT = 25 * MB + 64 * 1024;

let site: SqliteSite;
let server: Instance;
let cookie = '';
let passId = '';
const figures: Record<string, string | number> = {};
let slowest = 0;
let mostMemory = 0;
const signInFigures: Record<string, string | number> = {};

beforeAll(async () => {
  site = await sqliteSite();
  server = await site.start('A');
  cookie = await mustSignIn(server.url, 'cocreator@quadrille.test', DEMO_PASSWORD);
  const res = await fetch(`${server.url}/api/gags/demo-gag-12/passes`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json' },
    body: '{}',
  });
  passId = ((await res.json()) as { id: string }).id;
}, 180_000);

afterAll(async () => {
  recordFigures('bodies over their limit (413 after crossing it; server memory growth)', {
    'slowest 413 after the limit (ms)': Math.round(slowest),
    'largest memory growth while refusing (MB)': Math.round((mostMemory / MB) * 10) / 10,
    ...figures,
  });
  recordFigures('wrong passwords at once for one address', signInFigures);
  await site?.stop();
});

type Case = {
  name: string;
  path: () => string;
  /** The request's headers and the start of its body. */
  prepare: () => Promise<{ headers: Record<string, string>; head: Buffer }>;
  limit: number;
  tail?: Buffer;
  /** A small request first, so the route's code is loaded before memory is measured. */
  warm: () => Promise<unknown>;
};

const BOUNDARY = '----quadrille-soak';
const CASES: Case[] = [
  {
    name: 'JSON, anonymous sign-up (64 KB)',
    path: () => '/api/users',
    prepare: async () => ({ headers: { 'content-type': 'application/json' }, head: Buffer.from('{"name":"') }),
    limit: JSON_LIMIT,
    warm: () => fetch(`${server.url}/api/users`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' }),
  },
  {
    name: 'JSON, a batch of strokes (1 MB)',
    path: () => `/api/passes/${passId}/ops`,
    prepare: async () => ({
      headers: { 'content-type': 'application/json', cookie },
      head: Buffer.from('{"batchId":"big","ops":[{"op":"remove","strokeId":"'),
    }),
    limit: BATCH_LIMIT,
    warm: () =>
      fetch(`${server.url}/api/passes/${passId}/ops`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: '{}' }),
  },
  {
    name: 'sign-in form',
    path: () => '/api/auth/callback/credentials',
    prepare: async () => {
      const csrf = await csrfOf(server.url);
      return {
        headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: csrf.cookie },
        head: Buffer.from(`csrfToken=${csrf.token}&json=true&email=big%40pier.test&password=`),
      };
    },
    limit: SIGN_IN_LIMIT,
    warm: () => csrfOf(server.url),
  },
  {
    name: 'upload (25 MB)',
    path: () => `/api/series/${DEMO_SERIES_ID}/uploads`,
    // A PNG signature and then far too many bytes.
    prepare: async () => ({
      headers: { 'content-type': `multipart/form-data; boundary=${BOUNDARY}`, cookie },
      head: Buffer.concat([
        Buffer.from(`--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="huge.png"\r\nContent-Type: image/png\r\n\r\n`),
        Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      ]),
    }),
    limit: UPLOAD_LIMIT,
    tail: Buffer.from(`\r\n--${BOUNDARY}--\r\n`),
    warm: () => fetch(`${server.url}/api/series/${DEMO_SERIES_ID}/uploads`, { method: 'POST', headers: { cookie }, body: new FormData() }),
  },
];

describe('a body over its limit is refused while it arrives', () => {
  for (const c of CASES) {
    for (const chunked of [false, true]) {
      it(`${c.name}, ${chunked ? 'chunked without Content-Length' : 'with a declared Content-Length'}: 413 within 1 s, memory + < 50 MB`, async () => {
        await c.warm();
        const { headers, head } = await c.prepare();
        const r = await sendOversized({
          url: `${server.url}${c.path()}`,
          inst: server,
          headers,
          total: TOTAL,
          limit: c.limit,
          chunked,
          head,
          tail: c.tail,
          timeoutMs: 60_000,
        });
        slowest = Math.max(slowest, r.msAfterLimit ?? Infinity);
        mostMemory = Math.max(mostMemory, r.rssGrowth);
        figures[`${c.name}, ${chunked ? 'chunked' : 'declared'}`] =
          `${r.status ?? r.error} after ${(r.sent / MB).toFixed(1)} MB sent, ${r.msAfterLimit === null ? '—' : Math.round(r.msAfterLimit)} ms after the limit, memory +${(r.rssGrowth / MB).toFixed(1)} MB`;
        expect(r.status, `${c.name}: ${r.error ?? r.body.slice(0, 200)}`).toBe(413);
        expect(r.msAfterLimit!, 'ms from crossing the limit to the answer').toBeLessThan(MAX_MS_AFTER_LIMIT);
        expect(r.rssGrowth / MB, 'server memory growth (MB)').toBeLessThan(MAX_RSS_GROWTH / MB);
        // The server still answers afterwards.
        expect((await fetch(`${server.url}/api/health`)).status).toBe(200);
      });
    }
  }
});

const MAX_CHECKS = 10;

/** A new account; its address and password. */
async function account(): Promise<{ email: string; password: string }> {
  const email = `burst-${randomUUID()}@pier.test`;
  const password = `Low tide at the pier ${randomUUID()}`;
  const res = await fetch(`${server.url}/api/users`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ name: 'Burst', email, password }),
  });
  expect(res.status, await res.text()).toBe(201);
  return { email, password };
}

type Answer = { status: number; cookie: string | null; retryAfter: boolean };

describe('a burst of sign-ins for one address', () => {
  it('100 wrong passwords at once: at most 10 reach the password check, the rest 429; the right one afterwards is 429 too', async () => {
    const { email, password } = await account();
    const csrf = await csrfOf(server.url);
    const answers: Answer[] = await Promise.all(
      Array.from({ length: 100 }, async (_, i) => {
        const r = await signIn(server.url, email, `wrong password number ${i}`, csrf);
        return { status: r.status, cookie: r.cookie, retryAfter: r.status !== 429 || r.retryAfter };
      }),
    );
    const limited = answers.filter((a) => a.status === 429).length;
    const checked = answers.length - limited;
    const after = await signIn(server.url, email, password, csrf);
    signInFigures['100 wrong at once: answers'] = countBy(answers.map((a) => a.status));
    signInFigures['100 wrong at once: reached the password check'] = checked;
    signInFigures['right password afterwards'] = `${after.status}${after.cookie ? ', signed in' : ', not signed in'}`;
    expect(answers.filter((a) => a.cookie).length, 'wrong passwords that signed in').toBe(0);
    expect(checked, 'answers other than 429 (attempts that reached the password check)').toBeLessThanOrEqual(MAX_CHECKS);
    expect(answers.filter((a) => !a.retryAfter).length, '429 answers without Retry-After').toBe(0);
    expect(after.cookie, 'the right password after the limit signed in').toBeNull();
    expect(after.status).toBe(429);
  });

  it('39 wrong passwords and then the right one, all in one burst: the right one does not sign in', async () => {
    const { email, password } = await account();
    const csrf = await csrfOf(server.url);
    let answered = 0;
    const wrong = Array.from({ length: 39 }, (_, i) => signIn(server.url, email, `not it ${i}`, csrf).finally(() => (answered += 1)));
    // Last in the burst: sent while the wrong ones are still being answered.
    await new Promise((r) => setTimeout(r, 100));
    const unansweredWhenSent = 39 - answered;
    const right = await signIn(server.url, email, password, csrf);
    const answers = await Promise.all(wrong);
    signInFigures['39 wrong + right last: answers'] = countBy(answers.map((a) => a.status));
    signInFigures['39 wrong + right last: the right one'] =
      `${right.status}${right.cookie ? ', signed in' : ', not signed in'} (${unansweredWhenSent} wrong ones unanswered when it was sent)`;
    expect(answers.length - answers.filter((a) => a.status === 429).length, 'wrong ones that reached the password check').toBeLessThanOrEqual(
      MAX_CHECKS,
    );
    expect(right.cookie, 'the right password at the end of the burst signed in').toBeNull();
  });
});

function countBy(xs: number[]): string {
  const m = new Map<number, number>();
  for (const x of xs) m.set(x, (m.get(x) ?? 0) + 1);
  return [...m]
    .sort((a, b) => a[0] - b[0])
    .map(([k, n]) => `${n} × ${k}`)
    .join(', ');
}

describe('identical uploads at once', () => {
  it('six at once: one 201 and five 200 duplicates of it', async () => {
    const png = await sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 200, g: 180, b: 120 } } })
      .png()
      .toBuffer();
    const answers = await Promise.all(
      Array.from({ length: 6 }, async () => {
        const form = new FormData();
        form.append('file', new File([new Uint8Array(png)], 'pier.png', { type: 'image/png' }));
        const res = await fetch(`${server.url}/api/series/${DEMO_SERIES_ID}/uploads`, { method: 'POST', headers: { cookie }, body: form });
        return { status: res.status, body: (await res.json()) as { id?: string; duplicate?: boolean; error?: string } };
      }),
    );
    const statuses = answers.map((a) => a.status).sort();
    recordFigures('six identical uploads at once', { answers: statuses.join(', ') });
    expect(statuses, JSON.stringify(answers.map((a) => a.body))).toEqual([200, 200, 200, 200, 200, 201]);
    const created = answers.find((a) => a.status === 201)!.body.id;
    for (const a of answers.filter((x) => x.status === 200)) expect(a.body).toMatchObject({ id: created, duplicate: true });
    const list = (await (await fetch(`${server.url}/api/series/${DEMO_SERIES_ID}/uploads`, { headers: { cookie } })).json()) as {
      id: string;
      sha256: string;
    }[];
    const sha = list.find((u) => u.id === created)!.sha256;
    expect(
      list.filter((u) => u.sha256 === sha),
      'stored once',
    ).toHaveLength(1);
  });
});
