// `npm run soak`: the standing attack suites at full length (SOAK=1) — hostile bodies on SQLite and on
// PostgreSQL, writers across two processes with kill -9, the body-size, sign-in, upload and heavy-request
// attacks on the production server (`server/main.mjs`) — then one summary of what they measured, in the form README's "Reliability"
// section quotes. Extra arguments go to vitest (e.g. `npm run soak -- --project integration`).
// E2E_REUSE_BUILD=1 serves an existing `.next-test` build instead of building it first.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');
const report = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-soak-report-')), 'report.jsonl');
fs.writeFileSync(report, '');

const args = process.argv.slice(2);
const projects = args.some((a) => a.startsWith('--project')) ? [] : ['--project', 'integration', '--project', 'integration-pg', '--project', 'e2e'];
const started = Date.now();
const run = spawnSync(process.execPath, [path.join(root, 'node_modules/vitest/vitest.mjs'), 'run', ...projects, 'tests/soak', ...args], {
  cwd: root,
  stdio: 'inherit',
  env: { ...process.env, SOAK: '1', SOAK_REPORT: report },
});
const minutes = ((Date.now() - started) / 60_000).toFixed(1);

type Line = { suite: string; figures: Record<string, number | string> };
const lines: Line[] = fs
  .readFileSync(report, 'utf8')
  .split('\n')
  .filter(Boolean)
  .map((l) => JSON.parse(l) as Line);

const sum = (key: string) => lines.reduce((n, l) => n + (typeof l.figures[key] === 'number' ? (l.figures[key] as number) : 0), 0);
const first = (key: string) => lines.find((l) => l.figures[key] !== undefined)?.figures[key];
console.log(`\n## Soak summary (${new Date().toISOString().slice(0, 10)}, ${minutes} min, vitest exit ${run.status})\n`);
console.log('| figure | value |');
console.log('|---|---|');
console.log(`| requests tried | ${sum('requests').toLocaleString('en')} |`);
console.log(`| answers 5xx (hostile bodies; writers, 503 aside) | ${sum('5xx') + sum('5xx other than 503')} |`);
console.log(`| 503 with Retry-After, retried (two processes on one SQLite file) | ${sum('503 (retried)')} |`);
console.log(
  `| strokes acknowledged / present / missing / twice | ${sum('strokes acknowledged')} / ${sum('strokes present')} / ${sum('acknowledged but missing')} / ${sum('present twice')} |`,
);
console.log(`| kill -9 while writing; integrity_check | ${sum('kill -9 of a process')}; ${first('integrity_check') ?? '—'} |`);
console.log(`| /api/health p99 under heavy requests | ${first('health p99 (ms)') ?? '—'} ms (p50 ${first('health p50 (ms)') ?? '—'} ms) |`);
console.log(
  `| bodies over their limit (JSON, sign-in, upload; declared and chunked) | 413 at most ${first('slowest 413 after the limit (ms)') ?? '—'} ms after the limit; server memory +${first('largest memory growth while refusing (MB)') ?? '—'} MB at most |`,
);
console.log(
  `| memory growth of a process that served the writers (kill -9 survivor) | ${first('memory growth of the surviving process (MB)') ?? '—'} MB |`,
);
console.log('\n### Each suite\n');
for (const l of lines) {
  console.log(
    `- **${l.suite}**: ${Object.entries(l.figures)
      .map(([k, v]) => `${k} ${typeof v === 'number' ? v.toLocaleString('en') : v}`)
      .join('; ')}`,
  );
}
process.exit(run.status ?? 1);
