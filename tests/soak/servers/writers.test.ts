// Concurrent writers on one pass across two server processes (`server/main.mjs`) sharing one SQLite file, and one of
// them killed -9 while writing (issue 13, found 7; SQLite's documented locking and WAL behaviour:
// write transactions begin IMMEDIATE, a busy database answers 503 with Retry-After, never 500).
// Writers post batches to `POST /api/passes/:id/ops`, alternating between the processes, retry the same
// batch (same batchId) on a lost connection or a 503, and record every stroke the server acknowledged.
// Afterwards every acknowledged stroke is in the pass exactly once, every batch has its own seq, and
// `PRAGMA integrity_check` says ok — also right after each kill.
import SqliteDatabase from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '@/db/seed/demo-data';
import type { Instance } from '../../support/instances';
import { MB, type SqliteSite, groupRss, mustSignIn, sqliteSite, waitGone } from '../../support/servers';
import { SOAK, recordFigures, scale } from '../../support/soak';

const WRITERS = 8;
const BATCHES_PER_WRITER = scale(20, 250);
const KILLS = scale(1, 5);
const GAG = 'demo-gag-12';

let site: SqliteSite;
let servers: Instance[] = [];
let cookie = '';
let passId = '';

beforeAll(async () => {
  site = await sqliteSite();
  servers = [await site.start('A'), await site.start('B')];
  cookie = await mustSignIn(servers[0]!.url, 'cocreator@quadrille.test', DEMO_PASSWORD);
  const res = await fetch(`${servers[0]!.url}/api/gags/${GAG}/passes`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json' },
    body: '{}',
  });
  expect(res.status).toBe(201);
  passId = ((await res.json()) as { id: string }).id;
}, 180_000);

afterAll(async () => {
  await site?.stop();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A short pen stroke inside panel 0, different for each n. */
function stroke(id: string, n: number) {
  const y0 = 22 + (n % 36);
  const points = Array.from({ length: 24 }, (_, i) => [
    Math.round((20 + i * 1.6) * 100) / 100,
    Math.round((y0 + Math.sin(i / 3 + n) * 1.5) * 100) / 100,
    0.5,
  ]);
  return { id, panel: 0, tool: 'pen', grey: 80, size: 0.6, points };
}

function integrityCheck(): string {
  const db = new SqliteDatabase(site.file, { readonly: true });
  try {
    return (db.pragma('integrity_check') as { integrity_check: string }[]).map((r) => r.integrity_check).join('; ');
  } finally {
    db.close();
  }
}

describe('writers on one pass across two processes on one SQLite file', () => {
  it(
    `${WRITERS} writers × ${BATCHES_PER_WRITER} batches, process A killed -9 ${KILLS}× while writing: every acknowledged stroke once, integrity ok`,
    async () => {
      const sent = new Set<string>();
      const acked = new Set<string>();
      const seqOfBatch = new Map<string, number>();
      const tally = {
        requests: 0,
        ok: 0,
        busy503: 0,
        busyWithoutRetryAfter: 0,
        serverErrors: 0,
        refused: 0,
        connectionLost: 0,
        inFlightAtKills: [] as number[],
      };
      const problems: string[] = [];
      let inFlightToA = 0;
      const rssStart = groupRss(servers[1]!);
      const total = WRITERS * BATCHES_PER_WRITER;

      const writer = async (w: number) => {
        for (let b = 0; b < BATCHES_PER_WRITER; b++) {
          const batchId = `w${w}-b${b}`;
          const count = 1 + ((w + b) % 4);
          const strokes = Array.from({ length: count }, (_, s) => stroke(`${batchId}-s${s}`, w * 1000 + b * 4 + s));
          strokes.forEach((s) => sent.add(s.id));
          const body = JSON.stringify({ batchId, ops: strokes.map((s) => ({ op: 'add', stroke: s })) });
          for (let attempt = 0; ; attempt++) {
            if (attempt > 400) throw new Error(`batch ${batchId} never acknowledged`);
            // Alternate between the processes; after a failure, try the other one (a balancer would).
            const index = (w + b + attempt) % 2;
            const server = servers[index]!;
            tally.requests += 1;
            if (index === 0) inFlightToA += 1;
            try {
              const res = await fetch(`${server.url}/api/passes/${passId}/ops`, {
                method: 'POST',
                headers: { cookie, 'content-type': 'application/json' },
                body,
              });
              const text = await res.text();
              if (res.status === 200) {
                tally.ok += 1;
                const { seq } = JSON.parse(text) as { seq: number };
                const known = seqOfBatch.get(batchId);
                if (known !== undefined && known !== seq) problems.push(`batch ${batchId} answered seq ${known}, then ${seq} on a retry`);
                seqOfBatch.set(batchId, seq);
                strokes.forEach((s) => acked.add(s.id));
                break;
              }
              if (res.status === 503) {
                tally.busy503 += 1;
                if (!res.headers.get('retry-after')) tally.busyWithoutRetryAfter += 1;
                await sleep(50 + Math.random() * 100);
                continue;
              }
              if (res.status >= 500) {
                tally.serverErrors += 1;
                problems.push(`${server.name}: ${res.status} ${text.slice(0, 200)}`);
                await sleep(50);
                continue;
              }
              tally.refused += 1;
              problems.push(`${server.name}: batch ${batchId} refused ${res.status} ${text.slice(0, 200)}`);
              break;
            } catch {
              // The process is gone (killed, restarting): the batch may or may not have landed; send it again.
              tally.connectionLost += 1;
              await sleep(100);
            } finally {
              if (index === 0) inFlightToA -= 1;
            }
          }
        }
      };

      const killer = async () => {
        for (let k = 1; k <= KILLS; k++) {
          // Spread the kills over the run.
          while (seqOfBatch.size < (total * k) / (KILLS + 1)) await sleep(20);
          // Mid-write: with batches on their way to it.
          for (let i = 0; i < 400 && inFlightToA === 0; i++) await sleep(5);
          const a = servers[0]!;
          tally.inFlightAtKills.push(inFlightToA);
          a.kill('SIGKILL');
          await waitGone(a);
          const check = integrityCheck();
          if (check !== 'ok') problems.push(`integrity_check after kill ${k}: ${check}`);
          servers[0] = await site.start('A', a.port);
        }
      };

      const started = performance.now();
      await Promise.all([killer(), ...Array.from({ length: WRITERS }, (_, w) => writer(w))]);
      const ms = performance.now() - started;

      // What each process now says the pass holds.
      const present: Record<string, Map<string, number>> = {};
      for (const server of servers) {
        tally.requests += 1;
        const res = await fetch(`${server.url}/api/passes/${passId}`, { headers: { cookie } });
        expect(res.status).toBe(200);
        const { strokes } = (await res.json()) as { strokes: { id: string }[] };
        const counts = new Map<string, number>();
        for (const s of strokes) counts.set(s.id, (counts.get(s.id) ?? 0) + 1);
        present[server.name] = counts;
      }
      const onA = present.A!;
      const missing = [...acked].filter((id) => !onA.has(id));
      const doubled = [...onA].filter(([, n]) => n > 1).map(([id]) => id);
      const strangers = [...onA.keys()].filter((id) => !sent.has(id));
      const seqs = [...seqOfBatch.values()];
      const integrity = integrityCheck();
      const rssGrowth = groupRss(servers[1]!) - rssStart;

      recordFigures(`writers on one SQLite file (2 processes${SOAK ? ', soak' : ''})`, {
        writers: WRITERS,
        batches: total,
        requests: tally.requests,
        'answered 200': tally.ok,
        '503 (retried)': tally.busy503,
        '5xx other than 503': tally.serverErrors,
        'connections lost to kill -9 (retried)': tally.connectionLost,
        'kill -9 of a process': KILLS,
        'requests in flight to it at each kill': tally.inFlightAtKills.join(', '),
        'strokes acknowledged': acked.size,
        'strokes present': onA.size,
        'acknowledged but missing': missing.length,
        'present twice': doubled.length,
        integrity_check: integrity,
        'batches/s': Math.round((total / ms) * 1000),
        'memory growth of the surviving process (MB)': Math.round(rssGrowth / MB),
      });

      expect(problems).toEqual([]);
      expect(Math.max(...tally.inFlightAtKills), 'batches in flight to the process when it was killed').toBeGreaterThan(0);
      expect(tally.serverErrors, 'answers 5xx other than 503').toBe(0);
      expect(tally.busyWithoutRetryAfter, '503 answers without Retry-After').toBe(0);
      expect(seqOfBatch.size).toBe(total);
      expect(missing, 'acknowledged strokes missing from the pass').toEqual([]);
      expect(doubled, 'strokes present more than once').toEqual([]);
      expect(strangers, 'strokes nobody sent').toEqual([]);
      expect(new Set(seqs).size, 'batches sharing a seq').toBe(seqs.length);
      // Both processes read the same pass.
      expect([...present.B!.keys()].sort()).toEqual([...onA.keys()].sort());
      expect(integrity).toBe('ok');
    },
    SOAK ? 3_600_000 : 180_000,
  );
});
