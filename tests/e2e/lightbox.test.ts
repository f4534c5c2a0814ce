// The lightbox in Chromium, as an artist uses it: upload a scan of paper
// thumbnails from the editor (the progress bar shows), place it under panel 2
// at 40% opacity, draw over it, reload: both are there.
import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const GAG = `${baseUrl}/series/demo-kettle-crab/gags/demo-gag-11`;
let passId = '';

type ServerPass = {
  strokes: { id: string; panel: number }[];
  lightboxes: { panel: number | null; x: number; y: number; w: number; opacity: number; visible: boolean; rotation: number; uploadId: string }[];
};
const serverPass = (p: Page): Promise<ServerPass> => p.evaluate(async (id) => (await fetch(`/api/passes/${id}`)).json(), passId);
const canvasAttr = async (p: Page, name: string) => Number(await p.getByTestId('sketch-canvas').getAttribute(name));

beforeAll(async () => {
  await signIn(page, baseUrl, 'cocreator@quadrille.test');
});

describe('lightbox', () => {
  it('uploads a scan from the editor with a progress bar and places it under panel 2', async () => {
    await page.goto(GAG);
    await page.getByRole('button', { name: 'New pass' }).click();
    await page.waitForURL(/\/passes\/\d+$/);
    await page.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    passId = await page.evaluate(async () => {
      const gagId = location.pathname.split('/')[4];
      const passes = await (await fetch(`/api/gags/${gagId}/passes`)).json();
      return passes[passes.length - 1].id as string;
    });

    // A photographed page of thumbnails: noisy, so it weighs a few MB like a real one.
    const scan = await sharp({
      create: { width: 1771, height: 1771, channels: 3, background: '#ffffff', noise: { type: 'gaussian', mean: 170, sigma: 40 } },
    })
      .jpeg({ quality: 92 })
      .toBuffer();
    expect(scan.byteLength).toBeGreaterThan(1_000_000);
    // A slow upload link, so the bar is seen moving (Chromium's own network throttling).
    const cdp = await page.context().newCDPSession(page.mainFrame()); // the real frame: `page` is the fixture's stand-in
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 600 * 1024 });

    await page.getByLabel('Place the scan on').selectOption({ label: 'Panel 2 Build' });
    await page.getByLabel('Upload scans to place').setInputFiles([{ name: 'pier-thumbs-scan.jpg', mimeType: 'image/jpeg', buffer: scan }]);
    const bar = page.getByRole('progressbar', { name: 'Uploading pier-thumbs-scan.jpg' });
    await bar.waitFor();
    // Part-way: the bar shows real progress, neither empty nor full.
    await expect.poll(async () => Number(await bar.getAttribute('value')), { timeout: 20_000, interval: 50 }).toBeGreaterThan(0);
    const partWay = Number(await bar.getAttribute('value'));
    expect(partWay).toBeLessThan(1);
    await page.getByText('Done').waitFor({ timeout: 30_000 });
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

    const item = page.getByTestId('lightbox-item');
    await item.waitFor();
    expect(await item.textContent()).toContain('Panel 2 Build');
    await expect.poll(() => canvasAttr(page, 'data-lightbox-images'), { timeout: 10_000 }).toBe(1);
    // Print check: 1771 px across the fitted panel width, well over 300 ppi.
    expect(await page.getByTestId('print-check').textContent()).toMatch(/Print check: \d+ ppi at print size/);
  });

  it('sets 40% opacity, draws over it, and after a reload both are there', async () => {
    await page.getByLabel('Opacity of pier-thumbs-scan.jpg').fill('40');
    await expect.poll(async () => (await serverPass(page)).lightboxes[0]?.opacity, { timeout: 10_000 }).toBe(0.4);

    await page.getByRole('button', { name: 'Pen (1)' }).click();
    const canvas = page.getByTestId('sketch-canvas');
    const box = (await canvas.boundingBox())!;
    // Panel 2 is the top right of the page; draw a wavy line across it.
    const x0 = box.x + box.width * 0.56;
    const y0 = box.y + box.height * 0.3;
    await page.mouse.move(x0, y0);
    await page.mouse.down();
    for (let i = 1; i <= 12; i++) await page.mouse.move(x0 + i * 6, y0 + Math.sin(i / 2) * 8);
    await page.mouse.up();
    await page.locator('[data-sync-state="saved"]').waitFor();
    await expect.poll(async () => (await serverPass(page)).strokes.length).toBe(1);

    const saved = await serverPass(page);
    expect(saved.strokes[0]!.panel).toBe(1);
    expect(saved.lightboxes).toEqual([expect.objectContaining({ panel: 1, opacity: 0.4, visible: true, rotation: 0 })]);

    await page.reload();
    await page.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    await expect.poll(() => canvasAttr(page, 'data-stroke-count')).toBe(1);
    await expect.poll(() => canvasAttr(page, 'data-lightbox-images'), { timeout: 10_000 }).toBe(1);
    expect(await page.getByLabel('Opacity of pier-thumbs-scan.jpg').inputValue()).toBe('40');
  });

  it('moves it by dragging with "Arrange the lightbox"', async () => {
    const before = (await serverPass(page)).lightboxes[0]!;
    await page.keyboard.press('8');
    const box = (await page.getByTestId('sketch-canvas').boundingBox())!;
    const x0 = box.x + box.width * 0.66;
    const y0 = box.y + box.height * 0.35;
    await page.mouse.move(x0, y0);
    await page.mouse.down();
    for (let i = 1; i <= 8; i++) await page.mouse.move(x0 - i * 5, y0 + i * 3);
    await page.mouse.up();
    await expect.poll(async () => (await serverPass(page)).lightboxes[0]!.x, { timeout: 10_000 }).toBeLessThan(before.x);
    const after = (await serverPass(page)).lightboxes[0]!;
    expect(after.w).toBe(before.w); // moved, not scaled
    expect(after.y).toBeGreaterThan(before.y);
    expect((await serverPass(page)).strokes.length).toBe(1); // the stroke stays where it was drawn

    // The keyboard does the same: Shift+→ nudges it 10 mm right.
    await page.getByTestId('sketch-canvas').focus();
    await page.keyboard.press('Shift+ArrowRight');
    await expect.poll(async () => (await serverPass(page)).lightboxes[0]!.x, { timeout: 10_000 }).toBeCloseTo(after.x + 10, 2);
  });

  it('turns it a quarter and hides it, as operations of the pass', async () => {
    await page.getByRole('button', { name: 'Turn 90°' }).click();
    await expect.poll(async () => (await serverPass(page)).lightboxes[0]?.rotation, { timeout: 10_000 }).toBe(90);
    await page.getByRole('button', { name: 'Hide pier-thumbs-scan.jpg' }).click();
    await expect.poll(() => canvasAttr(page, 'data-lightbox-count')).toBe(0);
    await expect.poll(async () => (await serverPass(page)).lightboxes[0]?.visible, { timeout: 10_000 }).toBe(false);
    // The strokes are untouched by all of it.
    expect((await serverPass(page)).strokes.length).toBe(1);
  });
});
