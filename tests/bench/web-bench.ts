// Figures of the built app for `npm run bench` (issue 14): opening the editor
// on a 5,000-stroke pass against its floor measured in the same page, and the
// bytes of that pass on the wire, packed and as JSON.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import autocannon from 'autocannon';
import { build } from 'esbuild';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import { PASS_MEDIA_TYPE } from '@/lib/strokes/wire';
import { openBrowser, signIn } from '../e2e/browser';
import { type Instance, ROOT, ensureBuild, seed, startInstance } from '../support/instances';
import { passFilledFrom } from '../support/heavy-pass';
import { benchStrokes } from './strokes-fixture';

const DIST = '.next-test';
const GAG = 'demo-gag-04';
const N = 5000;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

export type WebFigures = {
  openMs: number;
  /** Where the last open's time went, ms since navigation: HTML, scripts, the pass's bytes asked and received, read (decoded, drawn as they came) and in the document. */
  openParts: { html: number; scriptsDone: number; dataStart: number; dataEnd: number; read: number; drawn: number };
  floorMs: number;
  strokesShown: number;
  packedBytes: number;
  jsonBytes: number;
  /** Gzipped bytes of the JavaScript a page's HTML loads (its first-load JS). */
  firstLoadJs: Record<string, number>;
  /** Requests a second with 20 connections, each route in turn, in one run (the median of three rounds; health measured around each). */
  api: { health: number; pass: number; gagsHealth: number; gags: number };
  /** Largest Contentful Paint of a board of BOARD_GAGS gags, ms since navigation (the median of five loads after a warm-up). */
  boardLcpMs: number;
  boardGags: number;
};

/** The board for the LCP guard: as many gags as a long-running series holds. */
const BOARD_GAGS = 300;

/** Requests a second a route sustains with 20 connections for a few seconds. */
async function reqPerSec(url: string, cookie: string, seconds = 4): Promise<number> {
  const result = await autocannon({ url, connections: 20, duration: seconds, headers: { cookie } });
  if (result.non2xx > 0 || result.errors > 0) throw new Error(`${url}: ${result.non2xx} non-2xx, ${result.errors} errors`);
  return result.requests.average;
}

// The board (issue 14's goal) and the editor page (the canvas code loads after it, on its own).
const FIRST_LOAD_PAGES = { board: '/series/demo-kettle-crab', editor: '/series/demo-kettle-crab/gags/demo-gag-01/passes/1' };

async function floorScript(): Promise<string> {
  const out = await build({
    entryPoints: [path.join(ROOT, 'tests/bench/editor-floor.ts')],
    bundle: true,
    write: false,
    format: 'iife',
    globalName: 'quadrilleFloor',
    platform: 'browser',
    target: 'es2022',
    tsconfig: path.join(ROOT, 'tsconfig.json'),
    logLevel: 'error',
  });
  return out.outputFiles[0]!.text;
}

export async function webFigures(): Promise<WebFigures> {
  ensureBuild(DIST);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-web-bench-'));
  const url = `file:${path.join(dir, 'web.sqlite')}`;
  seed(url);
  let app: Instance | undefined;
  const browser = await openBrowser();
  try {
    app = await startInstance({ name: 'web', distDir: DIST, databaseUrl: url, env: { S3_FAKE: 'off' } });
    const page = await browser.context.newPage();
    // The moment the editor says every stroke is drawn, on the page's own clock (ms since navigation).
    await page.addInitScript(() => {
      new MutationObserver(() => {
        const el = document.querySelector('[data-testid="sketch-canvas"][data-loaded="true"]');
        if (el && !(window as { __loadedAt?: number }).__loadedAt) (window as { __loadedAt?: number }).__loadedAt = performance.now();
      }).observe(document, { subtree: true, childList: true, attributes: true, attributeFilter: ['data-loaded'] });
    });
    await signIn(page, app.url, 'cocreator@quadrille.test');
    const pass = await passFilledFrom(page, GAG, benchStrokes(N), 'bench');
    const editorUrl = `${app.url}/series/demo-kettle-crab/gags/${GAG}/passes/${pass.number}`;
    const script = await floorScript();
    const opens: number[] = [];
    let parts = { html: 0, scriptsDone: 0, dataStart: 0, dataEnd: 0, read: 0, drawn: 0 };
    const floors: number[] = [];
    let shown = 0;
    for (let i = 0; i < 6; i++) {
      await page.goto(editorUrl);
      await page.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor({ timeout: 60_000 });
      if (i === 0) continue; // warm-up: server and browser caches, JIT
      opens.push(await page.evaluate(() => (window as { __loadedAt?: number }).__loadedAt!));
      parts = await page.evaluate((passId) => {
        const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
        const data = performance.getEntriesByType('resource').find((r) => r.name.endsWith(`/api/passes/${passId}`)) as
          PerformanceResourceTiming | undefined;
        const scripts = performance.getEntriesByType('resource').filter((r) => (r as PerformanceResourceTiming).initiatorType === 'script');
        return {
          html: Math.round(nav.responseEnd),
          scriptsDone: Math.round(Math.max(0, ...scripts.map((r) => (r as PerformanceResourceTiming).responseEnd))),
          dataStart: Math.round(data?.startTime ?? -1),
          dataEnd: Math.round(data?.responseEnd ?? -1),
          read: Math.round(performance.getEntriesByName('quadrille:pass-read')[0]?.startTime ?? -1),
          drawn: Math.round(performance.getEntriesByName('quadrille:pass-drawn')[0]?.startTime ?? -1),
        };
      }, pass.id);
      shown = Number(await page.getByTestId('sketch-canvas').getAttribute('data-stroke-count'));
      await page.addScriptTag({ content: script });
      const floor = await page.evaluate(
        ({ passId, spec, pxPerMm }) =>
          (
            window as unknown as {
              quadrilleFloor: { editorFloor: (id: string, s: unknown, px: number) => Promise<{ ms: number }> };
            }
          ).quadrilleFloor.editorFloor(passId, spec, pxPerMm * (window.devicePixelRatio || 1)),
        // The floor rasters at the resolution the editor did: its fitted view's.
        { passId: pass.id, spec: DEFAULT_PAGE_SPEC, pxPerMm: Number(await page.getByTestId('sketch-canvas').getAttribute('data-px-per-mm')) },
      );
      floors.push(floor.ms);
    }
    const firstLoadJs: Record<string, number> = {};
    for (const [name, at] of Object.entries(FIRST_LOAD_PAGES)) {
      // The scripts a page's HTML asks for (what Next.js calls first-load JS; chunks loaded later, on
      // demand, and the polyfills only old browsers take, marked nomodule, are not counted), gzipped
      // at zlib's default level as the server sends them.
      const html = await (await page.request.get(`${app.url}${at}`)).text();
      let total = 0;
      for (const [, attrs] of html.matchAll(/<script([^>]*)>/g)) {
        const src = /\bsrc="([^"]+)"/.exec(attrs!)?.[1];
        if (!src || /\bnomodule\b/i.test(attrs!)) continue;
        const body = await (await page.request.get(new URL(src.replace(/&amp;/g, '&'), app.url).toString())).body();
        total += gzipSync(body).length;
      }
      firstLoadJs[name] = total;
    }
    const cookie = (await browser.context.cookies()).map((c) => `${c.name}=${c.value}`).join('; ');
    // A pass of 40 strokes, as a gag page's pass usually is, for the API rows.
    const small = await page.evaluate(async (gagId) => {
      const res = await fetch(`/api/gags/${gagId}/passes`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' });
      return ((await res.json()) as { id: string }).id;
    }, GAG);
    await page.evaluate(
      async ({ passId, ops }) => {
        await fetch(`/api/passes/${passId}/ops`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ batchId: 'api-40', ops }),
        });
      },
      { passId: small, ops: benchStrokes(40, 3).map((stroke) => ({ op: 'add', stroke })) },
    );
    // Three rounds of health, the pass, the gags and health again, 3 s each: each round's ratios take the
    // health measured around them, and the row shows the round with the median ratio (a busy moment of the
    // machine then moves one round, not the figure).
    await reqPerSec(`${app.url}/api/health`, cookie, 2); // warm-up: route modules loaded, JIT
    const rounds: { health: number; pass: number; gags: number }[] = [];
    for (let i = 0; i < 3; i++) {
      const healthA = await reqPerSec(`${app.url}/api/health`, cookie, 3);
      const passRate = await reqPerSec(`${app.url}/api/passes/${small}`, cookie, 3);
      const gagsRate = await reqPerSec(`${app.url}/api/series/demo-kettle-crab/gags`, cookie, 3);
      const healthB = await reqPerSec(`${app.url}/api/health`, cookie, 3);
      rounds.push({ health: (healthA + healthB) / 2, pass: passRate, gags: gagsRate });
    }
    const medianRound = (k: 'pass' | 'gags') => [...rounds].sort((a, b) => a[k] / a.health - b[k] / b.health)[1]!;
    const api = {
      health: medianRound('pass').health,
      pass: medianRound('pass').pass,
      gagsHealth: medianRound('gags').health,
      gags: medianRound('gags').gags,
    };
    // The LCP guard: a series of its own with BOARD_GAGS gags (the rows above keep the demo's board), opened as a
    // person opens it; the page's last LCP candidate once it has settled.
    const boardGags = await page.evaluate(async (n) => {
      const series = (await (
        await fetch('/api/series', {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ title: 'Kettle Crab, the long run' }),
        })
      ).json()) as { id: string };
      let made = 0;
      for (let i = 0; i < n; i += 10) {
        const answers = await Promise.all(
          Array.from({ length: Math.min(10, n - i) }, (_, k) =>
            fetch(`/api/series/${series.id}/gags`, {
              method: 'POST',
              headers: { 'content-type': 'application/json' },
              body: JSON.stringify({ title: `Crab gag ${i + k + 1}`, premise: 'The crab and the kettle, once more.' }),
            }),
          ),
        );
        made += answers.filter((r) => r.status === 201).length;
      }
      return { seriesId: series.id, made };
    }, BOARD_GAGS);
    if (boardGags.made !== BOARD_GAGS) throw new Error(`the LCP board has ${boardGags.made} gags, not ${BOARD_GAGS}`);
    const lcps: number[] = [];
    for (let i = 0; i < 6; i++) {
      await page.goto(`${app.url}/series/${boardGags.seriesId}`, { waitUntil: 'load' });
      await page.getByText(`Crab gag ${BOARD_GAGS}`, { exact: true }).first().waitFor();
      const lcp = await page.evaluate(
        () =>
          new Promise<number>((resolve) => {
            let last = -1;
            new PerformanceObserver((list) => {
              for (const e of list.getEntries()) last = e.startTime;
            }).observe({ type: 'largest-contentful-paint', buffered: true });
            setTimeout(() => resolve(last), 500);
          }),
      );
      if (lcp < 0) throw new Error('the board reported no Largest Contentful Paint');
      if (i > 0) lcps.push(lcp); // the first load warms the server and the browser's caches
    }
    const bodyBytes = async (accept: string) =>
      (await (await fetch(`${app!.url}/api/passes/${pass.id}`, { headers: { cookie, accept, 'accept-encoding': 'identity' } })).arrayBuffer())
        .byteLength;
    return {
      openMs: median(opens),
      openParts: parts,
      floorMs: median(floors),
      strokesShown: shown,
      packedBytes: await bodyBytes(PASS_MEDIA_TYPE),
      jsonBytes: await bodyBytes('application/json'),
      firstLoadJs,
      api,
      boardLcpMs: median(lcps),
      boardGags: BOARD_GAGS,
    };
  } finally {
    await browser.close();
    app?.kill();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
