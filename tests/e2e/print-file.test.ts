// From a scan to the print file, in Chromium as a co-creator and the owner would: upload a final
// page on the gag page, fit it to the bleed and see its preflight turn green, then build the
// print file on the volume page, watch its progress bar, download it and read its boxes with
// poppler. Boxes: MediaBox = BleedBox ⊇ TrimBox (ISO 32000-1 §14.11.2); 1 in = 25.4 mm = 72 pt.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { pdfBoxesOf, pdfImagesOf } from '../support/poppler';
import { lineArtTiff } from '../support/scans';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
// A series of its own, so the gags it places do not change the demo board other browser tests count.
let SERIES_ID = '';
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-e2e-print-'));

type Spec = { trimW: number; trimH: number; bleed: number };
let volumeId = '';
let spec: Spec;
const gagIds: string[] = [];

const api = async (method: 'post' | 'get', url: string, data?: unknown) => {
  const r = await page.request[method](`${baseUrl}${url}`, data === undefined ? {} : { data });
  return { status: r.status(), body: (await r.json().catch(() => null)) as any };
};

/** A line-art scan drawn with its bleed, recording 300 ppi though scanned at 600: its fit on upload is to the trim. */
async function scan(s: Spec, mark: number) {
  const w = s.trimW + 2 * s.bleed;
  const h = s.trimH + 2 * s.bleed;
  return lineArtTiff({ w, h, ppi: 600, recordedPpi: 300, marks: [{ x: 20, y: 20 + mark, w: 40, h: 2 }] }, 'ccittfax4');
}

beforeAll(async () => {
  await signIn(page, baseUrl, 'owner@quadrille.test');
  const series = await api('post', '/api/series', { title: 'Harbour fair edition' });
  expect(series.status).toBe(201);
  SERIES_ID = series.body.id;
  const v = await api('post', `/api/series/${SERIES_ID}/volumes`, { title: 'Kettle Crab at the fair', deadline: '2027-05-01' });
  expect(v.status).toBe(201);
  volumeId = v.body.id;
  spec = v.body.spec;
  for (let i = 0; i < 4; i++) {
    const g = await api('post', `/api/series/${SERIES_ID}/gags`, { title: `Fair gag ${i + 1}`, premise: 'Kettle sells buckets of sea.' });
    expect(g.status).toBe(201);
    gagIds.push(g.body.id);
    expect((await api('post', `/api/volumes/${volumeId}/entries`, { gagId: g.body.id })).status).toBe(201);
  }
  // A title page last (its scan is uploaded on the volume page below).
  expect((await api('post', `/api/volumes/${volumeId}/entries`, { kind: 'title' })).status).toBe(201);
  // Three of the four gag pages get their scans by the API, fitted to the bleed; the first is done by hand below.
  for (const [i, gagId] of gagIds.slice(1).entries()) {
    const r = await page.request.post(`${baseUrl}/api/gags/${gagId}/final-pages`, {
      multipart: { file: { name: `fair-${i + 2}.tif`, mimeType: 'image/tiff', buffer: await scan(spec, i * 5) } },
    });
    expect(r.status()).toBe(201);
    const { id } = (await r.json()) as { id: string };
    const fit = await page.request.put(`${baseUrl}/api/final-pages/${id}/fit`, { data: { to: 'bleed', x: 0, y: 0, scale: 1, rotation: 0 } });
    expect(fit.status()).toBe(200);
  }
}, 120_000);

describe('the print file in the browser', () => {
  it('upload, fit to the bleed, preflight green; then the print file with its progress, downloaded and read', async () => {
    // The gag page: upload the scan; fitted to the trim on upload (the size its recorded ppi gives is not the bleed's),
    // it stops short of the bleed: a warning, as the scan's edge there is blank paper.
    await page.goto(`${baseUrl}/series/${SERIES_ID}/gags/${gagIds[0]}`);
    const panel = page.getByTestId('final-page-panel');
    const file = path.join(dir, 'fair-1.tif');
    fs.writeFileSync(file, await scan(spec, 40));
    await panel.getByLabel('Final page scan (TIFF, PNG or JPEG)').setInputFiles(file);
    const checks = panel.getByTestId('page-preflight');
    await checks.locator('[data-rule="bleed"][data-level="warn"]').first().waitFor({ timeout: 30_000 });

    // Fit it to the bleed and save: every check of the page is OK.
    await panel.getByLabel('the bleed (drawn with its bleed)').check();
    await panel.getByRole('button', { name: 'Save fit' }).click();
    await panel.getByRole('status').getByText('Fit saved.').waitFor({ timeout: 20_000 });
    await checks.locator('[data-rule="bleed"][data-level="ok"]').first().waitFor({ timeout: 20_000 });
    expect(await checks.locator('[data-level="fail"], [data-level="warn"]').count()).toBe(0);

    // The volume page: the title page's scan, recorded at the resolution it was scanned at, so it starts fitted to the bleed.
    await page.goto(`${baseUrl}/series/${SERIES_ID}/volumes/${volumeId}`);
    const matter = page.getByTestId('matter-final-pages');
    await matter.getByText('Page 5: Title page').click();
    const title = path.join(dir, 'title.tif');
    fs.writeFileSync(
      title,
      await lineArtTiff(
        { w: spec.trimW + 2 * spec.bleed, h: spec.trimH + 2 * spec.bleed, ppi: 600, marks: [{ x: 30, y: 70, w: 90, h: 3 }] },
        'ccittfax4',
      ),
    );
    await matter.getByLabel('Final page scan (TIFF, PNG or JPEG)').setInputFiles(title);
    await matter.getByTestId('page-preflight').locator('[data-rule="bleed"][data-level="ok"]').first().waitFor({ timeout: 30_000 });

    // The print file, watched while it is built.
    const print = page.getByTestId('print-file-panel');
    await print.getByRole('button', { name: 'Build the print file' }).waitFor();
    await page.evaluate(() => {
      const w = window as unknown as { sawProgress?: boolean };
      const seen = () => {
        if (document.querySelector('[data-testid="print-progress"]')) w.sawProgress = true;
      };
      new MutationObserver(seen).observe(document.body, { childList: true, subtree: true });
    });
    await print.getByRole('button', { name: 'Build the print file' }).click();
    const link = print.getByRole('link', { name: /^The print file \(8 pages, [\d.]+ MB\)$/ });
    await link.waitFor({ timeout: 120_000 });
    expect(await page.evaluate(() => (window as unknown as { sawProgress?: boolean }).sawProgress)).toBe(true);

    const res = await page.request.get(`${baseUrl}${await link.getAttribute('href')}`);
    expect(res.status()).toBe(200);
    const pdf = path.join(dir, 'print.pdf');
    fs.writeFileSync(pdf, await res.body());
    const b = pdfBoxesOf(pdf);
    expect(b.pages).toBe(8); // 5 pages and 3 blanks: saddle stitch takes a multiple of 4
    const pt = (mm: number) => (mm / 25.4) * 72;
    const W = pt(spec.trimW + 2 * spec.bleed);
    const H = pt(spec.trimH + 2 * spec.bleed);
    const bl = pt(spec.bleed);
    for (const boxes of [b.media, b.bleed]) {
      expect(boxes).toHaveLength(8);
      for (const box of boxes) [0, 0, W, H].forEach((v, i) => expect(Math.abs(box[i]! - v)).toBeLessThan(0.01));
    }
    for (const box of b.trim) [bl, bl, W - bl, H - bl].forEach((v, i) => expect(Math.abs(box[i]! - v)).toBeLessThan(0.01));
    // Each page's scan at its own pixels: 1-bit, 600 ppi across and down.
    const images = pdfImagesOf(pdf);
    expect(images).toHaveLength(5);
    for (const i of images) expect([i.color, i.bpc, i.xppi, i.yppi]).toEqual(['gray', 1, 600, 600]);
  }, 240_000);
});
