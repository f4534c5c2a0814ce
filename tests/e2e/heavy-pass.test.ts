// A pass of 5,000 strokes (60 points each) opens in the editor with every
// stroke drawn: the count the editor reports is the pass's, and each of the
// four panels shows ink where the strokes lie, so a fast open cannot come from
// skipping work.
import sharp from 'sharp';
import { describe, expect, inject, it } from 'vitest';
import { benchStrokes } from '../bench/strokes-fixture';
import { passFilledFrom } from '../support/heavy-pass';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const GAG = 'demo-gag-04';
const N = 5000;

describe('a heavy pass', () => {
  it('opens with all 5,000 strokes drawn, ink in every panel', async () => {
    await signIn(page, baseUrl, 'cocreator@quadrille.test');
    // Post from a page that follows nothing live (the gag page would redraw its cards after every batch).
    await page.goto(`${baseUrl}/series`);
    // Every batch must be accepted (the helper throws on any other answer).
    const pass = await passFilledFrom(page, GAG, benchStrokes(N), 'heavy');

    await page.goto(`${baseUrl}/series/demo-kettle-crab/gags/${GAG}/passes/${pass.number}`);
    const canvas = page.locator('[data-testid="sketch-canvas"][data-loaded="true"]');
    await canvas.waitFor({ timeout: 30_000 });
    expect(Number(await canvas.getAttribute('data-stroke-count'))).toBe(N);
    // The strokes were read once, by the script in the page's HTML, before the editor's code arrived:
    // the editor took that read rather than asking again.
    const reads = await page.evaluate((id) => {
      const all = performance.getEntriesByType('resource') as PerformanceResourceTiming[];
      const editorCode = all.filter((r) => r.initiatorType === 'script').map((r) => r.responseEnd);
      const pass = all.filter((r) => new URL(r.name).pathname === `/api/passes/${id}` && !new URL(r.name).search);
      return { count: pass.length, startedAt: pass[0]?.startTime ?? -1, lastScriptAt: Math.max(...editorCode) };
    }, pass.id);
    expect(reads.count).toBe(1);
    expect(reads.startedAt).toBeLessThan(reads.lastScriptAt);

    // The page as shown: each panel's quarter of the page holds a good share of dark pixels.
    const shot = await page.getByTestId('sketch-canvas').screenshot();
    const { data, info } = await sharp(shot).greyscale().raw().toBuffer({ resolveWithObject: true });
    const ink = [0, 0, 0, 0];
    const total = [0, 0, 0, 0];
    for (let y = 0; y < info.height; y++) {
      for (let x = 0; x < info.width; x++) {
        const q = (y < info.height / 2 ? 0 : 2) + (x < info.width / 2 ? 0 : 1);
        total[q]!++;
        if (data[y * info.width + x]! < 128) ink[q]!++;
      }
    }
    for (let q = 0; q < 4; q++) expect(ink[q]! / total[q]!).toBeGreaterThan(0.05);
  });
});
