// Two app instances on one PostgreSQL and one S3 fake, as a deployment behind
// a load balancer runs them. Browser A reaches the app through a load balancer
// that prefers instance A; browser B talks to instance B. Strokes, comments,
// presence and uploads cross between them live; when instance A is killed in
// the middle of drawing, browser A carries on through B and nothing is lost.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFailoverProxy } from '../support/failover-proxy';
import { freePort } from '../support/free-port';
import { type Deployment, startDeployment } from '../support/instances';
import { openBrowser, signIn } from './browser';

// Built by the e2e global setup.
const DIST = '.next-test';
const GAG_PATH = '/series/demo-kettle-crab/gags/demo-gag-12';

let deployment: Deployment;
let lb: Awaited<ReturnType<typeof startFailoverProxy>>;
let browserA: Awaited<ReturnType<typeof openBrowser>>;
let browserB: Awaited<ReturnType<typeof openBrowser>>;
let pageA: Page;
let pageB: Page;
let passNumber = 0;
let passId = '';

const strokeCount = async (p: Page) => Number(await p.getByTestId('sketch-canvas').getAttribute('data-stroke-count'));
const serverStrokeIds = (p: Page) =>
  p.evaluate(
    async (id) => ((await (await fetch(`/api/passes/${id}`, { cache: 'no-store' })).json()).strokes as { id: string }[]).map((s) => s.id),
    passId,
  );

async function drawStroke(p: Page, fx: number, fy: number) {
  const box = (await p.getByTestId('sketch-canvas').boundingBox())!;
  const x0 = box.x + box.width * fx;
  const y0 = box.y + box.height * fy;
  await p.mouse.move(x0, y0);
  await p.mouse.down();
  for (let i = 1; i <= 10; i++) await p.mouse.move(x0 + i * 6, y0 + Math.sin(i / 2) * 6);
  await p.mouse.up();
}

beforeAll(async () => {
  // The load balancer's port first: instance A's public URL is the balancer's.
  const lbPort = await freePort();
  const lbUrl = `http://127.0.0.1:${lbPort}`;
  deployment = await startDeployment({ distDir: DIST, count: 2, publicUrls: [lbUrl], env: { LIVE_HEARTBEAT_MS: '3000' } });
  const [a, b] = deployment.instances;
  lb = await startFailoverProxy(() => [a!.url, b!.url], lbPort);
  browserA = await openBrowser();
  browserB = await openBrowser();
  pageA = await browserA.context.newPage();
  pageB = await browserB.context.newPage();
  await signIn(pageA, lb.url, 'cocreator@quadrille.test');
  await signIn(pageB, b!.url, 'owner@quadrille.test');
  const made = await pageA.evaluate(async () =>
    (await fetch('/api/gags/demo-gag-12/passes', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' })).json(),
  );
  passNumber = made.number;
  passId = made.id;
}, 240_000);

afterAll(async () => {
  await browserA?.close();
  await browserB?.close();
  await lb?.close();
  await deployment?.stop();
});

describe('two instances on one PostgreSQL', () => {
  it('both answer health on PostgreSQL', async () => {
    for (const inst of deployment.instances) {
      const body = await (await fetch(`${inst.url}/api/health`)).json();
      expect(body).toEqual({ ok: true, db: 'postgres' });
    }
  });

  it('opens the same pass in two browsers, one per instance, and each sees the other is there', async () => {
    await pageA.goto(`${lb.url}${GAG_PATH}/passes/${passNumber}`);
    await pageB.goto(`${deployment.instances[1]!.url}${GAG_PATH}/passes/${passNumber}`);
    await pageA.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    await pageB.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    await expect.poll(() => pageB.getByTestId('presence').textContent(), { timeout: 10_000 }).toContain(`Tam Quill (in pass ${passNumber}`);
    await expect.poll(() => pageA.getByTestId('presence').textContent(), { timeout: 10_000 }).toContain(`Nell Harrow (in pass ${passNumber}`);
  });

  it('a stroke drawn on A appears on B without a reload, and B is told which panel A works on', async () => {
    // Upper right of the page: panel 2, the build.
    await drawStroke(pageA, 0.62, 0.25);
    await expect.poll(() => strokeCount(pageB), { timeout: 5000 }).toBe(1);
    await expect.poll(() => pageB.getByTestId('presence').textContent(), { timeout: 5000 }).toMatch(/Tam Quill \(in pass \d+, build panel\)/);
  });

  it('a comment posted on B appears on A', async () => {
    await pageB.getByLabel('Comment', { exact: true }).fill('Kettle should peek out sooner in the build.');
    await pageB.getByRole('button', { name: 'Post comment' }).click();
    await pageA.getByTestId('comment-thread').filter({ hasText: 'Kettle should peek out sooner' }).waitFor({ timeout: 5000 });
  });

  it('an upload made through A is served by B', async () => {
    const upload = await pageA.evaluate(async () => {
      const c = document.createElement('canvas');
      c.width = 64;
      c.height = 48;
      const g = c.getContext('2d')!;
      g.fillStyle = '#3a6';
      g.fillRect(0, 0, 64, 48);
      const blob = await new Promise<Blob>((r) => c.toBlob((b) => r(b!), 'image/png'));
      const form = new FormData();
      form.append('file', blob, 'pier-scan.png');
      const res = await fetch('/api/series/demo-kettle-crab/uploads', { method: 'POST', body: form });
      return { status: res.status, body: await res.json() };
    });
    expect(upload.status).toBe(201);
    const served = await pageB.evaluate(async (id) => {
      const res = await fetch(`/api/uploads/${id}/original`);
      return { status: res.status, type: res.headers.get('content-type'), bytes: (await res.arrayBuffer()).byteLength };
    }, upload.body.id as string);
    expect(served.status).toBe(200);
    expect(served.type).toBe('image/png');
    expect(served.bytes).toBeGreaterThan(50);
  });

  it('a print file started through A is followed and downloaded through B', async () => {
    // The owner (on B) makes a volume of one blank page; the co-creator (through A) asks for its print file.
    const volumeId = await pageB.evaluate(async () => {
      const post = (url: string, body: unknown) =>
        fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }).then((r) => r.json());
      const v = await post('/api/series/demo-kettle-crab/volumes', { title: 'Two-instance book', deadline: '2027-06-01' });
      await post(`/api/volumes/${v.id}/entries`, { kind: 'blank' });
      return v.id as string;
    });
    const started = await pageA.evaluate(async (id) => {
      const res = await fetch(`/api/volumes/${id}/print-jobs`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: '{"kind":"print"}',
      });
      return { status: res.status, body: await res.json() };
    }, volumeId);
    expect(started.status).toBe(202);
    // B reads the job's row until A's worker has finished it, then serves the file A stored.
    const done = await pageB.evaluate(async (jobId) => {
      for (let i = 0; i < 300; i++) {
        const { job } = await (await fetch(`/api/print-jobs/${jobId}`)).json();
        if (job.state === 'done' || job.state === 'failed') return job;
        await new Promise((r) => setTimeout(r, 100));
      }
      return null;
    }, started.body.job.id as string);
    expect(done).toMatchObject({ state: 'done', pages: 4 }); // one page and three blanks for saddle stitch
    const file = await pageB.evaluate(async (url) => {
      const res = await fetch(url);
      return { status: res.status, head: new TextDecoder().decode((await res.arrayBuffer()).slice(0, 5)) };
    }, done.file as string);
    expect(file).toEqual({ status: 200, head: '%PDF-' });
  });

  it('instance A killed mid-drawing: browser A goes on through B and every stroke ends up on B', async () => {
    const [a, b] = deployment.instances;
    await drawStroke(pageA, 0.25, 0.65);
    await drawStroke(pageA, 0.3, 0.7);
    await drawStroke(pageA, 0.7, 0.7);
    a!.kill('SIGKILL');
    // Drawn while A is gone; the balancer now sends everything to B.
    await drawStroke(pageA, 0.35, 0.3);
    expect(await strokeCount(pageA)).toBe(5);
    await pageA.locator('[data-sync-state="saved"]').waitFor({ timeout: 30_000 });
    const onB = await pageB.evaluate(
      async (id) => ((await (await fetch(`/api/passes/${id}`, { cache: 'no-store' })).json()).strokes as unknown[]).length,
      passId,
    );
    expect(onB).toBe(5);
    expect(new Set(await serverStrokeIds(pageA)).size).toBe(5);
    await expect.poll(() => strokeCount(pageB), { timeout: 10_000 }).toBe(5);
    // Browser A's stream reconnected through the balancer to B: B's strokes reach A again.
    await drawStroke(pageB, 0.7, 0.3);
    await expect.poll(() => strokeCount(pageA), { timeout: 15_000 }).toBe(6);
    expect(b!.server.exitCode).toBeNull();
  });
});
