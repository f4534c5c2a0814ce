// One heavy request must not stall everyone (issue 13, found 6): while the thumbnail of a 50,000-stroke
// pass, a findings run on it and 100 sign-ins are in flight on the production server (`npm start`:
// server/main.mjs), `/api/health` still answers with a p99 under 200 ms, as seen from a process of its own
// (tests/support/health-probe.ts) — the goal, held by the soak over the whole heavy work; `npm test`'s short
// run (its first 10 s) holds it to twice that. Health is asked every 25 ms whatever the answers (an open loop, so a
// stalled server shows as the long waits it causes rather than as fewer samples).
import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/db/client';
import { createPass } from '@/db/queries/passes';
import { applyBatch } from '@/db/queries/batches';
import { DEMO_PASSWORD } from '@/db/seed/demo-data';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import { benchStrokes } from '../../bench/strokes-fixture';
import type { Instance } from '../../support/instances';
import { type SqliteSite, csrfOf, mustSignIn, signIn, sqliteSite } from '../../support/servers';
import { SOAK, percentile, recordFigures, scale } from '../../support/soak';
import { startHealthProbe } from '../../support/health-probe';

const STROKES = 50_000;
// 20 points a stroke: the thumbnail (an SVG of ~100 MB) and the findings each cost seconds of CPU.
const POINTS = 20;
const SIGN_INS = 100;
const HEALTH_EVERY_MS = 25;
const P99_MS = 200;
// The short run watches health for 10 s of the heavy work and then lets it go; the soak waits for all of it.
const WINDOW_MS = scale(10_000, 240_000);

let site: SqliteSite;
let server: Instance;
let passId = '';
let viewer = '';
let seededIn = 0;

beforeAll(async () => {
  site = await sqliteSite();
  // The big pass goes in through the pass log's own query functions, before the server opens the file.
  process.env.DATABASE_URL = site.databaseUrl;
  const db = await getDb();
  passId = (await createPass(db, { gagId: 'demo-gag-12', userId: 'demo-user-owner' })).id;
  const seeding = performance.now();
  const strokes = benchStrokes(STROKES, 13, POINTS);
  for (let i = 0; i < strokes.length; i += 5000) {
    const ops = strokes.slice(i, i + 5000).map((stroke) => ({ op: 'add' as const, stroke }));
    await applyBatch(db, { passId, batchId: `big-${i}`, ops, userId: 'demo-user-owner', spec: DEFAULT_PAGE_SPEC });
  }
  await closeDb();
  seededIn = performance.now() - seeding;
  // The seeding wrote some 100 MB: let the disk take it now, so the kernel's writeback of the test's own
  // setup does not hold up the server's first commits (an fsync on ext4 waits for the journal it shares).
  execFileSync('sync');
  server = await site.start('A');
  viewer = await mustSignIn(server.url, 'viewer@quadrille.test', DEMO_PASSWORD);
}, 300_000);

afterAll(async () => {
  await site?.stop();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** The answer's status (0 when the connection was dropped, -1 when still running when given up on) and how long it took. */
async function timed(fn: (signal: AbortSignal) => Promise<Response>, signal: AbortSignal): Promise<{ status: number; ms: number }> {
  const t0 = performance.now();
  try {
    const res = await fn(signal);
    await res.arrayBuffer();
    return { status: res.status, ms: performance.now() - t0 };
  } catch {
    return { status: signal.aborted ? -1 : 0, ms: performance.now() - t0 };
  }
}

const shown = (r: { status: number; ms: number }) =>
  r.status === -1 ? `still running after ${Math.round(r.ms)} ms` : `${r.status} in ${Math.round(r.ms)} ms`;

describe('heavy requests beside light ones', () => {
  it(`/api/health p99 < ${SOAK ? P99_MS : 2 * P99_MS} ms while a ${STROKES.toLocaleString('en')}-stroke thumbnail, its findings and ${SIGN_INS} sign-ins run`, async () => {
    for (let i = 0; i < 5; i++) await fetch(`${server.url}/api/health`);
    // The floor beside the figure: ${SIGN_INS} health checks at once, on connections of their own, with nothing
    // heavy running — what the arrival of a burst of that size costs this server and machine by itself.
    const burst = await Promise.all(
      Array.from({ length: SIGN_INS }, async () => {
        const started = performance.now();
        await (await fetch(`${server.url}/api/health`, { headers: { connection: 'close' } })).arrayBuffer();
        return performance.now() - started;
      }),
    );
    const csrf = await csrfOf(server.url);
    const probe = await startHealthProbe(`${server.url}/api/health`, HEALTH_EVERY_MS);
    const stop = new AbortController();
    const t0 = performance.now();
    const thumbnail = timed(
      (signal) => fetch(`${server.url}/api/passes/${passId}/thumbnail.svg`, { headers: { cookie: viewer }, signal }),
      stop.signal,
    );
    const findings = timed((signal) => fetch(`${server.url}/api/passes/${passId}/findings`, { headers: { cookie: viewer }, signal }), stop.signal);
    const signIns = Promise.all(
      Array.from({ length: SIGN_INS }, (_, i) =>
        timed(async (signal) => {
          const r = await signIn(server.url, `nobody-${i}-${Date.now()}@pier.test`, 'not a password anyone has', csrf, signal);
          return new Response(null, { status: r.status });
        }, stop.signal),
      ),
    ).then((answers) => ({ ms: performance.now() - t0, statuses: answers.map((a) => a.status) }));
    let busy = true;
    const heavy = Promise.all([thumbnail, findings, signIns]).finally(() => (busy = false));

    // Health every 25 ms while the heavy requests run (in the short run, for WINDOW_MS at most).
    const samples: number[] = [];
    const out = new Map<Promise<void>, number>();
    while (busy && performance.now() - t0 < WINDOW_MS) {
      const started = performance.now();
      const p: Promise<void> = fetch(`${server.url}/api/health`, { signal: stop.signal })
        .then((r) => r.arrayBuffer())
        .then(
          () => void samples.push(performance.now() - started),
          // A health request that failed outright is as bad as one never answered.
          () => void (stop.signal.aborted || samples.push(Infinity)),
        )
        .finally(() => out.delete(p));
      out.set(p, started);
      await sleep(HEALTH_EVERY_MS);
    }
    // Health answers still owed get a few seconds; one never answered counts as long as it was waited for.
    await Promise.race([Promise.all(out.keys()), sleep(5000)]);
    for (const started of out.values()) samples.push(performance.now() - started);
    const probed = await probe.stop();
    if (busy) stop.abort();
    const [thumb, find, sign] = await heavy;
    const p99 = percentile(samples, 0.99);
    const statuses = new Map<number, number>();
    for (const s of sign.statuses) statuses.set(s, (statuses.get(s) ?? 0) + 1);
    recordFigures(`/api/health under heavy requests${SOAK ? ' (soak)' : ''}`, {
      [`${STROKES} strokes stored through the query functions (ms)`]: Math.round(seededIn),
      [`${SIGN_INS} health checks at once, nothing heavy running: slowest (ms)`]: Math.round(Math.max(...burst)),
      'health samples': samples.length,
      'health p50 (ms)': Math.round(percentile(samples, 0.5)),
      'health p99 (ms)': Math.round(p99),
      'health max (ms)': Math.round(Math.max(...samples)),
      'probe samples': probed.length,
      'probe p50 (ms)': Math.round(percentile(probed, 0.5)),
      'probe p99 (ms)': Math.round(percentile(probed, 0.99)),
      'probe max (ms)': Math.round(Math.max(...probed)),
      [`thumbnail.svg of ${STROKES} strokes`]: shown(thumb),
      findings: shown(find),
      [`${SIGN_INS} sign-ins`]: `${[...statuses].map(([s, n]) => `${n} × ${s === -1 ? 'still running' : s === 0 ? 'connection dropped' : s}`).join(', ')} in ${Math.round(sign.ms)} ms`,
    });
    // What finished, finished well (the soak waits for all of it).
    for (const r of [thumb, find]) expect([200, ...(SOAK ? [] : [-1])], shown(r)).toContain(r.status);
    expect(
      sign.statuses.filter((s) => s >= 500 || s === 0),
      'sign-ins answered 5xx or dropped',
    ).toEqual([]);
    expect(samples.length).toBeGreaterThan(10);
    expect(probed.length).toBeGreaterThan(10);
    // The goal is read from the probe, a process of its own: the test's process also receives the 50,000-stroke
    // thumbnail (tens of MB) and the sign-ins' answers, and its own asks wait for that work too. Its figure is
    // held to a looser bound, so a stall the probe missed still fails.
    // The 200 ms goal is the soak's (`npm run soak`, the whole heavy work): speed goals stay out of `npm test`,
    // where other work on a 2-core machine moves a latency figure. The short run there guards against the stalls
    // this check was written for (p99 of 0.5–15 s before the front door and the worker pools) at twice the goal.
    const bound = SOAK ? P99_MS : 2 * P99_MS;
    expect(percentile(probed, 0.99), `health p99 (ms) seen by the probe over ${probed.length} samples`).toBeLessThan(bound);
    expect(p99, `health p99 (ms) seen by the test's own process over ${samples.length} samples`).toBeLessThan(2 * bound);
  }, 300_000);
});
