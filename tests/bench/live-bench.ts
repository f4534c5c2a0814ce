// Live figures for `npm run bench` (issue 10): how soon a stroke posted to one
// instance shows on another through the SSE stream (and through a 1 s poll), and
// how many batches per second 8 writers on one pass get on PostgreSQL and SQLite.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { readSse } from '../support/sse';
import { type Deployment, type Instance, ensureBuild, seed, startDeployment, startInstance } from '../support/instances';

const DIST = '.next-test';
const GAG = 'demo-gag-12';
const STROKES = 200;
const POLL_MS = 1000;
const WRITERS = 8;
const BATCHES_PER_WRITER = 40;
// A stream event later than this counts as missed rather than stalling the bench.
const EVENT_TIMEOUT_MS = 5000;

/** `sharedSeqs`: batches answered with a seq another batch also got (the per-pass queue did not hold). */
export type Integrity = {
  expected: number;
  strokes: number;
  lost: number;
  duplicated: number;
  seq: number;
  sharedSeqs: number;
  failedPosts: number;
  ok: boolean;
};
export type Throughput = { batches: number; ms: number; perSecond: number; integrity: Integrity };
export type LiveFigures = {
  streamP50: number;
  streamP95: number;
  streamMissed: number;
  pollP50: number;
  pollP95: number;
  pollMissed: number;
  strokes: number;
  pg: Throughput;
  sqlite: Throughput;
};

/** Nearest-rank percentile. */
export function percentile(xs: number[], p: number): number {
  if (xs.length === 0) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil(p * s.length) - 1))]!;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Signs the demo co-creator in through next-auth's own endpoints, as a browser does. Sessions are recorded in the
 * database, so a cookie works on every instance of one deployment (they share it) and on no other.
 */
async function cookie(base: string): Promise<string> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: {
      'content-type': 'application/x-www-form-urlencoded',
      cookie: csrf.headers
        .getSetCookie()
        .map((c) => c.split(';')[0])
        .join('; '),
    },
    body: new URLSearchParams({ csrfToken, email: 'cocreator@quadrille.test', password: 'kettle-crab-demo', json: 'true' }).toString(),
  });
  const session = res.headers.getSetCookie().find((c) => c.startsWith('next-auth.session-token='));
  if (!session) throw new Error(`Signing in to ${base} failed: HTTP ${res.status} ${await res.text()}`);
  return session.split(';')[0]!;
}

type Api = {
  createPass: (base: string) => Promise<string>;
  post: (base: string, passId: string, batchId: string, strokeId: string, n: number) => Promise<number>;
  get: (base: string, passId: string, since?: number) => Promise<{ seq: number; strokes: { id: string }[] }>;
};

function api(cookieHeader: string): Api {
  const headers = { cookie: cookieHeader, 'content-type': 'application/json' };
  const must = async (res: Response, what: string) => {
    if (!res.ok) throw new Error(`${what}: HTTP ${res.status} ${await res.text()}`);
    return res.json();
  };
  return {
    createPass: async (base) =>
      (await must(await fetch(`${base}/api/gags/${GAG}/passes`, { method: 'POST', headers, body: '{}' }), 'create pass')).id,
    post: async (base, passId, batchId, strokeId, n) => {
      const body = JSON.stringify({ batchId, ops: [{ op: 'add', stroke: strokeFor(strokeId, n) }] });
      return (await must(await fetch(`${base}/api/passes/${passId}/ops`, { method: 'POST', headers, body }), `post ${batchId}`)).seq;
    },
    get: async (base, passId, since) =>
      must(
        await fetch(`${base}/api/passes/${passId}${since === undefined ? '' : `?since=${since}`}`, { headers: { cookie: cookieHeader } }),
        'get pass',
      ),
  };
}

/** A short wavy pen stroke inside panel 0 (20–60 mm stays clear of its edges). */
function strokeFor(id: string, n: number) {
  const y0 = 22 + (n % 36);
  const points = Array.from({ length: 24 }, (_, i) => [
    Math.round((20 + i * 1.6) * 100) / 100,
    Math.round((y0 + Math.sin(i / 3 + n) * 1.5) * 100) / 100,
    0.5 + 0.02 * (i % 10),
  ]);
  return { id, panel: 0, tool: 'pen', grey: 80, size: 0.6, points };
}

/**
 * Reads a pass's SSE stream the way EventSource would and records when each
 * `pass:<id>` seq arrives (performance.now(), the same clock the POSTs use).
 */
function openStream(base: string, passId: string, cookieHeader: string) {
  const arrived = new Map<number, number>();
  const waiters = new Map<number, () => void>();
  const abort = new AbortController();
  let hello: (seq: number) => void;
  const helloSeq = new Promise<number>((r) => (hello = r));
  let gotHello = false;
  const done = (async () => {
    const res = await fetch(`${base}/api/passes/${passId}/events`, {
      headers: { cookie: cookieHeader, accept: 'text/event-stream' },
      signal: abort.signal,
    });
    if (!res.ok || !res.body) throw new Error(`stream: HTTP ${res.status}`);
    await readSse(res.body, {
      event: (data, at) => {
        const e = data as { topic: string; type: string; seq?: number };
        if (e.topic !== `pass:${passId}` || e.type !== 'seq' || e.seq === undefined) return;
        if (!gotHello) {
          gotHello = true;
          hello!(e.seq);
          return;
        }
        if (!arrived.has(e.seq)) arrived.set(e.seq, at);
        waiters.get(e.seq)?.();
      },
    });
  })().catch((err) => {
    if (!abort.signal.aborted) throw err;
  });
  return {
    helloSeq,
    done,
    /** When seq arrived, waiting up to EVENT_TIMEOUT_MS; undefined if it never did. */
    arrival: (seq: number) =>
      arrived.has(seq)
        ? Promise.resolve(arrived.get(seq))
        : new Promise<number | undefined>((resolve) => {
            const t = setTimeout(() => {
              waiters.delete(seq);
              resolve(undefined);
            }, EVENT_TIMEOUT_MS);
            waiters.set(seq, () => {
              clearTimeout(t);
              waiters.delete(seq);
              resolve(arrived.get(seq));
            });
          }),
    close: () => abort.abort(),
  };
}

async function latency(a: Instance, b: Instance, c: Api, cookieHeader: string) {
  const passId = await c.createPass(a.url);
  const stream = openStream(b.url, passId, cookieHeader);
  const postedAt = new Map<string, number>();
  const pollDelay = new Map<string, number>();
  const streamMs: number[] = [];
  let streamMissed = 0;
  let polling = false;
  let poller: Promise<unknown> = Promise.resolve();
  try {
    await firstOf(stream.helloSeq, stream.done, 10_000, 'hello on the stream from instance B');
    // Fresh server processes load each route module on first use; keep that out of the figures.
    for (let i = 0; i < 10; i++) {
      const seq = await c.post(a.url, passId, `warm-${i}`, `warm-${i}`, i);
      await stream.arrival(seq);
      await c.get(b.url, passId, Math.max(0, seq - 1));
    }

    let since = (await c.get(b.url, passId, 0)).seq;
    polling = true;
    poller = (async () => {
      const start = performance.now();
      // A fixed cadence, as setInterval in a tab would poll, not drifting by each request's time.
      for (let k = 1; polling; k++) {
        await sleep(Math.max(0, start + k * POLL_MS - performance.now()));
        if (!polling) break;
        const delta = await c.get(b.url, passId, since);
        const at = performance.now();
        since = delta.seq;
        for (const s of delta.strokes) {
          const t = postedAt.get(s.id);
          if (t !== undefined && !pollDelay.has(s.id)) pollDelay.set(s.id, at - t);
        }
      }
    })();

    for (let i = 0; i < STROKES; i++) {
      const id = `lat-${i}`;
      const t0 = performance.now();
      postedAt.set(id, t0);
      const seq = await c.post(a.url, passId, `lat-b${i}`, id, i);
      const at = await stream.arrival(seq);
      if (at === undefined) streamMissed++;
      else streamMs.push(at - t0);
      await sleep(20);
    }
    // Give the poller a couple more rounds to pick up the last strokes.
    const until = performance.now() + 2.5 * POLL_MS;
    while (pollDelay.size < STROKES && performance.now() < until) await sleep(50);
  } finally {
    polling = false;
    const pollError = await poller.then(
      () => null,
      (err: Error) => err,
    );
    stream.close();
    await stream.done;
    if (pollError) throw pollError;
  }
  const pollMs = [...pollDelay.values()];
  return {
    streamP50: percentile(streamMs, 0.5),
    streamP95: percentile(streamMs, 0.95),
    streamMissed,
    pollP50: percentile(pollMs, 0.5),
    pollP95: percentile(pollMs, 0.95),
    pollMissed: STROKES - pollMs.length,
    strokes: STROKES,
  };
}

/** Waits for `value`, failing if `ended` settles first or after `ms`. */
async function firstOf<T>(value: Promise<T>, ended: Promise<unknown>, ms: number, what: string): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  try {
    return await Promise.race([
      value,
      ended.then(() => Promise.reject(new Error(`no ${what}: the stream ended`))),
      new Promise<never>((_, reject) => (timer = setTimeout(() => reject(new Error(`no ${what} within ${ms / 1000} s`)), ms))),
    ]);
  } finally {
    clearTimeout(timer);
  }
}

/** 8 writers, each posting one-stroke batches one after another, all on one pass. */
async function throughput(targets: string[], c: Api, tag: string): Promise<Throughput> {
  const passId = await c.createPass(targets[0]!);
  // Warm each instance's ops route on a pass of its own, so the timed pass holds only timed batches.
  const scratch = await c.createPass(targets[0]!);
  for (const base of new Set(targets))
    for (let i = 0; i < 3; i++) await c.post(base, scratch, `warm-${tag}-${base.slice(-5)}-${i}`, `warm-${base.slice(-5)}-${i}`, i);

  const seqs: number[] = [];
  let failedPosts = 0;
  const t0 = performance.now();
  await Promise.all(
    Array.from({ length: WRITERS }, async (_, w) => {
      const base = targets[w % targets.length]!;
      for (let i = 0; i < BATCHES_PER_WRITER; i++) {
        try {
          seqs.push(await c.post(base, passId, `${tag}-w${w}-b${i}`, `${tag}-w${w}-s${i}`, w * BATCHES_PER_WRITER + i));
        } catch (err) {
          failedPosts++;
          console.error(`[bench] ${(err as Error).message}`);
        }
      }
    }),
  );
  const ms = performance.now() - t0;

  const expected = WRITERS * BATCHES_PER_WRITER;
  const state = await c.get(targets[0]!, passId);
  const ids = state.strokes.map((s) => s.id);
  const unique = new Set(ids);
  const wanted = Array.from({ length: WRITERS }, (_, w) => Array.from({ length: BATCHES_PER_WRITER }, (_, i) => `${tag}-w${w}-s${i}`)).flat();
  const lost = wanted.filter((id) => !unique.has(id)).length;
  const duplicated = ids.length - unique.size;
  // Every batch must also have taken its own seq, 1..expected each once: clients read ?since=seq, so a shared seq can hide a stroke from them.
  const sharedSeqs = seqs.length - new Set(seqs).size;
  const seqsOk = sharedSeqs === 0 && Math.min(...seqs) === 1 && Math.max(...seqs) === expected;
  const integrity = {
    expected,
    strokes: ids.length,
    lost,
    duplicated,
    seq: state.seq,
    sharedSeqs,
    failedPosts,
    ok: failedPosts === 0 && lost === 0 && duplicated === 0 && ids.length === expected && state.seq === expected && seqsOk,
  };
  return { batches: expected, ms, perSecond: (expected / ms) * 1000, integrity };
}

export async function liveFigures(): Promise<LiveFigures> {
  ensureBuild(DIST);

  let deployment: Deployment | undefined;
  let lat: Awaited<ReturnType<typeof latency>>;
  let pg: Throughput;
  try {
    deployment = await startDeployment({ distDir: DIST, count: 2 });
    const [a, b] = deployment.instances as [Instance, Instance];
    const cookieHeader = await cookie(a.url);
    const c = api(cookieHeader);
    lat = await latency(a, b, c, cookieHeader);
    pg = await throughput([a.url, b.url], c, 'pg');
  } finally {
    await deployment?.stop();
  }

  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-live-bench-'));
  let single: Instance | undefined;
  let sqlite: Throughput;
  try {
    const url = `file:${path.join(dir, 'bench.sqlite')}`;
    seed(url);
    single = await startInstance({ name: 'sqlite', distDir: DIST, databaseUrl: url, env: { S3_FAKE: 'off' } });
    sqlite = await throughput([single.url], api(await cookie(single.url)), 'sqlite');
  } finally {
    single?.kill('SIGKILL');
    fs.rmSync(dir, { recursive: true, force: true });
  }
  return { ...lat, pg, sqlite };
}
