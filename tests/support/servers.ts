// Real server processes (`server/main.mjs`) of the e2e build (`.next-test`, made by tests/e2e/global-setup.ts) on one
// SQLite file, for the attack suites that need processes: kill -9 while writing, two processes writing
// one file, a server's memory while a body streams in, and answer times while heavy work runs.
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { startFakeS3 } from '@/lib/storage/fake-s3';
import { freePort } from './free-port';
import { type Instance, seed, startInstance } from './instances';

export const DIST = '.next-test';

export type SqliteSite = {
  dir: string;
  /** The SQLite file every instance opens. */
  file: string;
  databaseUrl: string;
  instances: Instance[];
  /** Starts one more server on the file (on `port` to come back where a killed one was). */
  start: (name: string, port?: number) => Promise<Instance>;
  stop: () => Promise<void>;
};

/** A seeded SQLite file, an S3 fake, and as many instances as `start` is asked for. */
export async function sqliteSite(): Promise<SqliteSite> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-soak-'));
  const file = path.join(dir, 'soak.sqlite');
  const databaseUrl = `file:${file}`;
  seed(databaseUrl);
  const s3Port = await freePort();
  const s3 = await startFakeS3(s3Port, path.join(dir, 's3'), 'quadrille');
  const env = {
    S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
    S3_BUCKET: 'quadrille',
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    MAIL_FAKE: 'off',
  };
  const instances: Instance[] = [];
  return {
    dir,
    file,
    databaseUrl,
    instances,
    start: async (name, port) => {
      const inst = await startInstance({ name, distDir: DIST, databaseUrl, env, port });
      instances.push(inst);
      return inst;
    },
    stop: async () => {
      // Profiled (CPU_PROF_DIR), the servers end gracefully so their profiles are written.
      for (const inst of instances) inst.kill(process.env.CPU_PROF_DIR ? 'SIGTERM' : 'SIGKILL');
      if (process.env.CPU_PROF_DIR) await new Promise((r) => setTimeout(r, 3000));
      await s3.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Waits until the process group of a killed instance has gone. */
export async function waitGone(inst: Instance, ms = 10_000): Promise<void> {
  const deadline = Date.now() + ms;
  while (Date.now() < deadline && groupPids(inst.server.pid!).length) await new Promise((r) => setTimeout(r, 50));
}

/** The processes of a process group (an instance is the server and what it starts, in its own group). */
export function groupPids(pgid: number): number[] {
  const out: number[] = [];
  for (const d of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(d)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${d}/stat`, 'utf8');
      // Fields after "(comm)": state, ppid, pgrp, …
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      if (Number(fields[2]) === pgid && fields[0] !== 'Z') out.push(Number(d));
    } catch {
      /* gone meanwhile */
    }
  }
  return out;
}

/** Resident memory of an instance's whole process group, in bytes (VmRSS from /proc/<pid>/status). */
export function groupRss(inst: Instance): number {
  let total = 0;
  for (const pid of groupPids(inst.server.pid!)) {
    try {
      const m = /VmRSS:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
      if (m) total += Number(m[1]) * 1024;
    } catch {
      /* gone meanwhile */
    }
  }
  return total;
}

export const MB = 1024 * 1024;

/** Signs in through next-auth's own endpoints, as a script would (README, "JSON API"). */
export async function signIn(
  base: string,
  email: string,
  password: string,
  csrf?: Csrf,
  signal?: AbortSignal,
): Promise<{ status: number; cookie: string | null; body: string; retryAfter: boolean }> {
  const { token, cookie } = csrf ?? (await csrfOf(base));
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: 'POST',
    signal,
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie },
    body: new URLSearchParams({ csrfToken: token, email, password, json: 'true' }).toString(),
  });
  const session = res.headers.getSetCookie().find((c) => /next-auth\.session-token=[^;]+/.test(c));
  return { status: res.status, cookie: session ? session.split(';')[0]! : null, body: await res.text(), retryAfter: res.headers.has('retry-after') };
}

export type Csrf = { token: string; cookie: string };

/** next-auth's CSRF token and the cookie it must travel with (one pair serves many sign-ins). */
export async function csrfOf(base: string): Promise<Csrf> {
  const res = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await res.json()) as { csrfToken: string };
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0]!)
    .join('; ');
  return { token: csrfToken, cookie };
}

/** A signed-in cookie, or a thrown error saying why not. */
export async function mustSignIn(base: string, email: string, password: string): Promise<string> {
  const r = await signIn(base, email, password);
  if (!r.cookie) throw new Error(`sign-in as ${email} failed: ${r.status} ${r.body}`);
  return r.cookie;
}

export type OversizedResult = {
  status: number | null;
  body: string;
  /** Bytes handed to the socket before the answer came (or all of them). */
  sent: number;
  /** From the moment the bytes sent crossed the limit to the answer's headers; null if never answered. */
  msAfterLimit: number | null;
  /** The largest rise of the server's memory over its level just before, while the body was going in. */
  rssGrowth: number;
  error?: string;
};

/**
 * Streams a body of `total` bytes (`head`, then `fill` repeated, then `tail`) to the server, with a
 * declared Content-Length or chunked, and stops as soon as the server answers. Measures how long after
 * crossing `limit` bytes the answer came, and the server's memory meanwhile. A raw socket, not an HTTP
 * client: a server that answers and closes mid-body makes an HTTP client report the broken pipe instead
 * of the answer that arrived first.
 */
export async function sendOversized(opts: {
  url: string;
  inst: Instance;
  headers: Record<string, string>;
  total: number;
  limit: number;
  chunked: boolean;
  head?: Buffer;
  tail?: Buffer;
  timeoutMs?: number;
}): Promise<OversizedResult> {
  const url = new URL(opts.url);
  const head = opts.head ?? Buffer.alloc(0);
  const tail = opts.tail ?? Buffer.alloc(0);
  const chunk = Buffer.alloc(64 * 1024, 'a');
  const baseline = groupRss(opts.inst);
  let peak = baseline;
  const sampler = setInterval(() => {
    peak = Math.max(peak, groupRss(opts.inst));
  }, 20);
  const headers: Record<string, string> = { ...opts.headers, host: url.host, connection: 'close' };
  if (opts.chunked) headers['transfer-encoding'] = 'chunked';
  else headers['content-length'] = String(opts.total);
  const requestHead = `POST ${url.pathname}${url.search} HTTP/1.1\r\n${Object.entries(headers)
    .map(([k, v]) => `${k}: ${v}\r\n`)
    .join('')}\r\n`;

  let sent = 0;
  let crossedAt: number | null = null;
  let answeredAt: number | null = null;
  let status: number | null = null;
  let received = '';
  let error: string | undefined;
  const socket = net.connect(Number(url.port), url.hostname);
  const closed = new Promise<void>((resolve) => socket.once('close', () => resolve()));
  socket.setEncoding('latin1');
  socket.on('data', (d: string) => {
    if (received.length < 16_384) received += d;
    // The first final status line (a 100 Continue may come first).
    for (const m of received.matchAll(/HTTP\/1\.[01] (\d{3})[^\r\n]*\r\n/g)) {
      const code = Number(m[1]);
      if (code >= 200 && status === null) {
        status = code;
        answeredAt = performance.now();
        socket.end();
        // Time enough for the rest of a short answer; the server need not close at once.
        setTimeout(() => socket.destroy(), 500);
      }
    }
  });
  socket.on('error', (e) => {
    // A server that answered may close mid-body; only a failure before any answer counts.
    if (status === null) error = e.message;
  });
  await new Promise<void>((resolve, reject) => socket.once('connect', resolve).once('error', reject));
  const timer = setTimeout(() => {
    if (status === null) error = `no answer within ${opts.timeoutMs ?? 60_000} ms`;
    socket.destroy();
  }, opts.timeoutMs ?? 60_000);

  const write = (b: Buffer | string) => (socket.destroyed || socket.writableEnded ? true : socket.write(b));
  const pieces = function* () {
    yield head;
    let left = opts.total - head.length - tail.length;
    while (left > 0) {
      const n = Math.min(left, chunk.length);
      yield n === chunk.length ? chunk : chunk.subarray(0, n);
      left -= n;
    }
    yield tail;
  };
  // A server that answered and closed makes the next write fail, and Node drops a failed socket with the
  // answer unread (curl or a browser would still read it). So the client gives the server its moment to
  // answer where it should — after the headers (a declared length over the limit), and for up to 1.5 s
  // after the bytes cross the limit — before it writes on; a server still reading by then gets the rest.
  const answerWithin = async (ms: number) => {
    const end = performance.now() + ms;
    while (status === null && !socket.destroyed && performance.now() < end) await new Promise((r) => setTimeout(r, 5));
  };
  write(requestHead);
  if (!opts.chunked) await answerWithin(200);
  for (const piece of pieces()) {
    if (status !== null || socket.destroyed) break;
    if (!piece.length) continue;
    let ok = true;
    if (opts.chunked) ok = write(`${piece.length.toString(16)}\r\n`) && ok;
    ok = write(piece) && ok;
    if (opts.chunked) ok = write('\r\n') && ok;
    sent += piece.length;
    if (!ok) await new Promise<void>((r) => socket.once('drain', () => r()).once('close', () => r()));
    if (crossedAt === null && sent > opts.limit) {
      crossedAt = performance.now();
      await answerWithin(1500);
    }
    await new Promise((r) => setImmediate(r));
  }
  if (status === null && !socket.destroyed && opts.chunked) write('0\r\n\r\n');
  await closed;
  clearTimeout(timer);
  clearInterval(sampler);
  peak = Math.max(peak, groupRss(opts.inst));
  const bodyStart = received.indexOf('\r\n\r\n', received.search(/HTTP\/1\.[01] [2-5]\d\d/));
  return {
    status,
    body: bodyStart >= 0 ? Buffer.from(received.slice(bodyStart + 4), 'latin1').toString('utf8') : '',
    sent,
    // Answered before the limit was even crossed (a declared length over it): no delay at all.
    msAfterLimit: answeredAt === null ? null : crossedAt === null ? 0 : Math.max(0, answeredAt - crossedAt),
    rssGrowth: peak - baseline,
    error,
  };
}
