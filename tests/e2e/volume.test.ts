// The volume page in Chromium: reorder with the mouse and the keyboard (kept
// after a reload), an unplaced gag placed by keyboard alone and by mouse, the
// flatplan's blank-page warning, its stand-ins with their preflight marks and its
// printer spreads, an export with its progress bar that downloads a PDF.
import fs from 'node:fs';
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const VOLUME = `${baseUrl}/series/demo-kettle-crab/volumes/demo-volume-low-tide`;

/** What dnd-kit's live region (role status) last said to screen readers. */
const said = (p: Page) => p.locator('[id^="DndLiveRegion"]').textContent();
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
    // No final pages in the demo: every page is a stand-in, marked so, with its preflight level in words beside it.
    expect(await page.getByTestId('flatplan-not-final').count()).toBe(9);
    await expect.poll(() => page.getByTestId('flatplan-preflight').count(), { timeout: 15_000 }).toBe(9);
    expect(await page.getByTestId('flatplan-preflight').first().textContent()).toBe('Must fix: no final page');
    // Printer spreads, by keyboard: 9 pages take no saddle-stitched sheets until the blanks are added, and it says so.
    const printer = page.getByRole('button', { name: 'Printer spreads' });
    await printer.focus();
    await page.keyboard.press('Enter');
    expect(await printer.getAttribute('aria-pressed')).toBe('true');
    expect(await page.getByTestId('printer-spreads-note').textContent()).toMatch(/multiple of 4: add 3 blank pages first/);
    await page.getByRole('button', { name: 'Reader spreads' }).click();
    expect(await page.getByTestId('flatplan-page').count()).toBe(9);
  });

  it('reorders with the mouse, and a reload keeps the order', async () => {
    const handle = page.getByRole('button', { name: 'Move page 3, Low Tide Lunch', exact: true });
    const target = page.getByTestId('running-order-entry').nth(4);
    const a = (await handle.boundingBox())!;
    const b = (await target.boundingBox())!;
    // The reload below waits for the move to be stored, not for a fixed time.
    const stored = page.waitForResponse((r) => r.url().endsWith('/position') && r.request().method() === 'PUT');
    await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
    await page.mouse.down();
    for (let i = 1; i <= 12; i++) await page.mouse.move(a.x + a.width / 2, a.y + ((b.y + b.height / 2 + 4 - a.y) * i) / 12);
    await page.mouse.up();
    expect((await stored).status()).toBe(200);
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
    // Pick up, two steps up in quick succession (the list may still be re-rendering the first when the
    // second comes: each still moves it one place), hear where it would go, drop.
    await page.keyboard.press('Space');
    await expect.poll(() => said(page)).toBe('Page 9, Afterword would stay at page 9, after Finders Keepers.');
    await page.keyboard.press('ArrowUp');
    await page.keyboard.press('ArrowUp');
    await expect.poll(() => said(page)).toBe('Page 9, Afterword would go to page 7, after Whistle Alarm.');
    await page.keyboard.press('Space');
    await expect.poll(() => said(page)).toBe('Page 9, Afterword was dropped at page 7, after Whistle Alarm.');
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

  it('places an unplaced gag by keyboard alone: each arrow moves it one place, and it lands where announced', async () => {
    const before = await names(page);
    expect(before).toHaveLength(9);
    await page.getByRole('button', { name: 'Drag Handle Swing into the volume' }).focus();
    // Picked up over the end (where "add" puts it), then one place per key, both ways: each key, then
    // what a screen reader hears (waited for, as a person listens before the next key).
    const steps: [string, string][] = [
      ['Space', 'The gag Handle Swing would go to page 10, after Finders Keepers.'],
      ['ArrowUp', 'The gag Handle Swing would go to page 9, after Moving Day.'],
      ['ArrowUp', 'The gag Handle Swing would go to page 8, after Afterword.'],
      ['ArrowUp', 'The gag Handle Swing would go to page 7, after Whistle Alarm.'],
      ['ArrowUp', 'The gag Handle Swing would go to page 6, after Low Tide Lunch.'],
      ['ArrowUp', 'The gag Handle Swing would go to page 5, after Lid Umbrella.'],
      ['ArrowUp', 'The gag Handle Swing would go to page 4, after Spout Periscope.'],
      ['ArrowDown', 'The gag Handle Swing would go to page 5, after Lid Umbrella.'],
      ['ArrowUp', 'The gag Handle Swing would go to page 4, after Spout Periscope.'],
      ['ArrowUp', 'The gag Handle Swing would go to page 3, after Title page.'],
    ];
    for (const [key, heard] of steps) {
      await page.keyboard.press(key);
      await expect.poll(() => said(page)).toBe(heard);
    }
    await page.keyboard.press('Space');
    await expect.poll(() => said(page)).toBe('The gag Handle Swing was dropped at page 3, after Title page.');
    const want = [...before.slice(0, 2), 'Handle Swing', ...before.slice(2)];
    await expect.poll(() => names(page)).toEqual(want);
    // The keyboard stays on the gag, now page 3 of the running order.
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('Move page 3, Handle Swing');
    await page.reload();
    await page.getByRole('heading', { name: 'Low Tide' }).waitFor();
    expect(await names(page)).toEqual(want);
  });

  it('escape puts a picked-up gag back; the first page and the end are reachable by keyboard', async () => {
    const before = await names(page);
    const grip = page.getByRole('button', { name: 'Drag Sideways Race into the volume' });
    await grip.focus();
    await page.keyboard.press('Space');
    await expect.poll(() => said(page)).toBe(`The gag Sideways Race would go to page ${before.length + 1}, after ${before.at(-1)}.`);
    // Quick presses, as a held-down key repeats: each still moves it one place, and the top stops it.
    for (let i = 0; i < before.length + 3; i++) await page.keyboard.press('ArrowUp');
    await expect.poll(() => said(page)).toBe('The gag Sideways Race would go to page 1, before Cover.');
    await page.keyboard.press('Escape');
    await expect.poll(() => said(page)).toBe('Moving the gag Sideways Race was cancelled; nothing changed.');
    await page.waitForTimeout(300);
    expect(await names(page)).toEqual(before);
    // Picked up again and dropped at once: added after the last page.
    await grip.focus();
    await page.keyboard.press('Space');
    await expect.poll(() => said(page)).toBe(`The gag Sideways Race would go to page ${before.length + 1}, after ${before.at(-1)}.`);
    await page.keyboard.press('Space');
    await expect.poll(() => names(page)).toEqual([...before, 'Sideways Race']);
  });

  it('drags an unplaced gag in with the mouse, in front of the page it is dropped on', async () => {
    const before = await names(page);
    const grip = page.getByRole('button', { name: 'Drag Sugar Cube into the volume' });
    const target = page.getByTestId('running-order-entry').nth(1); // "Title page"
    const a = (await grip.boundingBox())!;
    const b = (await target.boundingBox())!;
    await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
    await page.mouse.down();
    const steps = 15;
    for (let i = 1; i <= steps; i++) {
      await page.mouse.move(a.x + ((b.x + b.width / 2 - a.x) * i) / steps, a.y + ((b.y + b.height / 2 - a.y) * i) / steps);
    }
    await page.mouse.up();
    await expect.poll(() => names(page)).toEqual([before[0], 'Sugar Cube', ...before.slice(1)]);
  });

  it('the planner counts the cover until it is marked done', async () => {
    const hours = () =>
      page.evaluate(async () => ((await (await fetch('/api/volumes/demo-volume-low-tide/plan')).json()) as { hoursLeft: number }).hoursLeft);
    const before = await hours();
    await page.getByRole('checkbox', { name: 'Page 1, Cover, done' }).check();
    // The cover's three stages: 0.5 + 1.5 + 0.25 h (the planner's defaults).
    await expect.poll(hours).toBeCloseTo(before - 2.25, 10);
    await expect.poll(() => page.getByTestId('plan-verdict').textContent()).toContain(`${(before - 2.25).toFixed(1)} hours left`);
    await page.reload();
    expect(await page.getByRole('checkbox', { name: 'Page 1, Cover, done' }).isChecked()).toBe(true);
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
