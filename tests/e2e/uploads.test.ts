// Uploading a scan from the gag page, in Chromium: the progress bar shows and
// the scan is listed with its preview, served through the app.
import sharp from 'sharp';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();

beforeAll(async () => {
  await signIn(page, baseUrl, 'cocreator@quadrille.test');
});

describe('scans and photos', () => {
  it('uploads a scan with a progress bar, and lists it with its preview', async () => {
    await page.goto(`${baseUrl}/series/demo-kettle-crab/gags/demo-gag-09`);
    const scan = await sharp({ create: { width: 1771, height: 1771, channels: 3, background: '#f7f2e8' } })
      .jpeg({ quality: 90 })
      .toBuffer();
    await page.getByLabel('Upload scans or photos').setInputFiles([{ name: 'tea-party-scan.jpg', mimeType: 'image/jpeg', buffer: scan }]);
    await page.getByTestId('upload-progress').first().waitFor();
    const item = page.getByTestId('uploads').getByText('tea-party-scan.jpg');
    await item.waitFor({ timeout: 20_000 });
    expect(await page.getByTestId('uploads').textContent()).toContain('1771 × 1771 px');
    const loaded = await page
      .getByRole('img', { name: 'tea-party-scan.jpg' })
      .evaluate((img: HTMLImageElement) => (img.complete ? img.naturalWidth : new Promise<number>((r) => (img.onload = () => r(img.naturalWidth)))));
    expect(loaded).toBe(320); // the preview: longest side 320 px
  });

  it('a text file is refused with a clear message', async () => {
    await page
      .getByLabel('Upload scans or photos')
      .setInputFiles([{ name: 'notes.png', mimeType: 'image/png', buffer: Buffer.from('not a picture') }]);
    await page.getByRole('alert').filter({ hasText: 'Only PNG, JPEG and WebP images can be used' }).waitFor();
  });
});
