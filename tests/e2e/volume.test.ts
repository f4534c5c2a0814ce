// The volume page in Chromium: reorder with the mouse and the keyboard (kept
// after a reload), the flatplan's blank-page warning, an export with its
// progress bar that downloads a PDF.
import fs from 'node:fs';
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const VOLUME = `${baseUrl}/series/demo-kettle-crab/volumes/demo-volume-low-tide`;

const names = (p: Page) => p.getByTestId('running-order-entry').evaluateAll((els) => els.map((e) => e.querySelector('span.flex-1')!.textContent));

beforeAll(async () => {
  await signIn(page, baseUrl, 'owner@quadrille.test');
});

describe('volume "Low Tide"', () => {
  it('shows the running order and the flatplan warning about blank pages', async () => {
    await page.goto(VOLUME);
    await page.getByRole('heading', { name: 'Low Tide' }).waitFor();
    expect(await names(page)).toEqual([
      'Cover',
      'Title page',
      'Low Tide Lunch',
      'Spout Periscope',
      'Lid Umbrella',
      'Whistle Alarm',
      'Moving Day',
      'Finders Keepers',
      'Afterword',
    ]);
    const warning = page.getByTestId('flatplan-warnings');
    await warning.getByText(/9 pages cannot be saddle stitched/).waitFor();
    expect(await warning.textContent()).toMatch(/add 3 blank pages, best after page 8/);
    expect(await page.getByTestId('flatplan-page').count()).toBe(9);
  });

  it('reorders with the mouse, and a reload keeps the order', async () => {
    const handle = page.getByRole('button', { name: 'Move page 3, Low Tide Lunch', exact: true });
    const target = page.getByTestId('running-order-entry').nth(4);
    const a = (await handle.boundingBox())!;
    const b = (await target.boundingBox())!;
    await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
    await page.mouse.down();
    for (let i = 1; i <= 12; i++) await page.mouse.move(a.x + a.width / 2, a.y + ((b.y + b.height / 2 + 4 - a.y) * i) / 12);
    await page.mouse.up();
    const want = [
      'Cover',
      'Title page',
      'Spout Periscope',
      'Lid Umbrella',
      'Low Tide Lunch',
      'Whistle Alarm',
      'Moving Day',
      'Finders Keepers',
      'Afterword',
    ];
    await expect.poll(() => names(page)).toEqual(want);
    await page.waitForTimeout(500);
    await page.reload();
    await page.getByRole('heading', { name: 'Low Tide' }).waitFor();
    expect(await names(page)).toEqual(want);
  });

  it('reorders with the keyboard, and a reload keeps the order', async () => {
    await page.getByRole('button', { name: 'Move page 9, Afterword', exact: true }).focus();
    // Pick up, two steps up, drop: with a beat between keys, as a person types.
    for (const key of ['Space', 'ArrowUp', 'ArrowUp', 'Space']) {
      await page.keyboard.press(key);
      await page.waitForTimeout(150);
    }
    const want = [
      'Cover',
      'Title page',
      'Spout Periscope',
      'Lid Umbrella',
      'Low Tide Lunch',
      'Whistle Alarm',
      'Afterword',
      'Moving Day',
      'Finders Keepers',
    ];
    await expect.poll(() => names(page)).toEqual(want);
    await page.waitForTimeout(500);
    await page.reload();
    await page.getByRole('heading', { name: 'Low Tide' }).waitFor();
    expect(await names(page)).toEqual(want);
  });

  it('an export shows its progress bar and downloads a PDF', async () => {
    const downloading = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Review dummy (PDF)' }).click();
    await page.getByTestId('export-progress').waitFor();
    const file = await downloading;
    expect(file.suggestedFilename()).toBe('review-dummy.pdf');
    const saved = await file.path();
    expect(fs.readFileSync(saved!).subarray(0, 5).toString()).toBe('%PDF-');
  });
});
