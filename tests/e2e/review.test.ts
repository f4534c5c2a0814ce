// The review loop in Chromium: an editor compares two passes, pins a comment on
// panel 3 and stamps "ready to ink"; the owner sees the stamp, the comment and
// the e-mail; a co-creator draws in that pass and the stamp is gone.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const GAG = `${baseUrl}/series/demo-kettle-crab/gags/demo-gag-07`; // "Sugar Cube": in review, two passes, started by the owner

let other: Awaited<ReturnType<typeof openBrowser>>;
let page2: Page;
beforeAll(async () => {
  other = await openBrowser();
  page2 = await other.context.newPage();
});
afterAll(async () => {
  await other?.close();
});

describe('review loop', () => {
  it('the editor compares two passes: side by side, overlaid, at print size, squinted', async () => {
    await signIn(page, baseUrl, 'editor@quadrille.test');
    await page.goto(GAG);
    await page.getByRole('link', { name: 'Compare passes' }).click();
    await page.waitForURL(/\/compare$/);
    const side = page.getByTestId('compare-side');
    await side.waitFor();
    expect(await side.getByRole('img', { name: /^Pass [12]$/ }).count()).toBe(2);
    expect(await side.getByText(/^[AB] · Pass [12]$/).allTextContents()).toEqual(['A · Pass 1', 'B · Pass 2']);
    await page.getByRole('button', { name: 'Overlay' }).click();
    await page.getByTestId('compare-overlay').waitFor();
    await page.getByLabel('Opacity of the older pass').fill('0.3');
    expect(await page.getByTestId('compare-overlay').textContent()).toContain('30%');
    await page.getByRole('button', { name: 'Print size' }).click();
    await page.getByRole('button', { name: 'Calibrate with a card' }).click();
    const card = page.getByTestId('calibration-card');
    await page.getByLabel('Card width in pixels').fill('428'); // 428 px ÷ 85.60 mm = 5 px per mm
    const box = (await card.boundingBox())!;
    expect(box.width).toBeCloseTo(428, 0);
    expect(box.height).toBeCloseTo(53.98 * 5, 0); // ISO/IEC 7810 ID-1: 85.60 × 53.98 mm
    const printed = (await page.locator('[data-label$="at print size"]').boundingBox())!;
    expect(printed.width).toBeCloseTo(156 * 5, 0); // 150 mm trim + 2 × 3 mm bleed, at 5 px/mm
    await page.getByRole('button', { name: 'Squint' }).click();
    await page.getByTestId('compare-squint').waitFor();
  });

  it('pins a comment on panel 3 and stamps the pass "ready to ink"', async () => {
    await page.goto(GAG);
    await page.getByRole('heading', { name: 'Review' }).waitFor();
    await page.getByLabel('Pin to').selectOption({ label: 'Pass 2, panel 3 (Turn)' });
    await page.getByLabel('Comment', { exact: true }).fill('@Nell Harrow the wave hides the turn; lift the horizon?');
    await page.getByRole('button', { name: 'Post comment' }).click();
    const thread = page.getByTestId('comment-thread').filter({ hasText: 'the wave hides the turn' });
    await thread.waitFor();
    expect(await thread.textContent()).toContain('Pass 2, panel 3 (Turn)');
    await page.getByLabel('Note for the stamp').fill('Reads without a word.');
    await page.getByRole('button', { name: 'Stamp “ready to ink”' }).click();
    // Sugar Cube's payoff has no note yet: the stamp asks first, naming that finding.
    const ask = page.getByRole('dialog');
    await ask.waitFor();
    expect(await ask.getByTestId('stamp-findings').textContent()).toContain('Beats without a note: Payoff.');
    await ask.getByRole('button', { name: 'Stamp “ready to ink” anyway' }).click();
    await expect.poll(async () => page.getByTestId('current-stamp').textContent()).toContain('Ready to ink');
    await expect.poll(async () => page.getByText('Ready to ink', { exact: true }).first().isVisible()).toBe(true);
  });

  it('the owner sees the stamp, the comment and the e-mails in /dev/mail', async () => {
    await signIn(page2, baseUrl, 'owner@quadrille.test');
    await page2.goto(GAG);
    await page2.getByTestId('current-stamp').waitFor();
    expect(await page2.getByTestId('current-stamp').textContent()).toMatch(/Ready to ink.*Ivo Sand, pass 2/s);
    await page2.getByTestId('comment-thread').filter({ hasText: 'the wave hides the turn' }).waitFor();
    await page2.goto(`${baseUrl}/dev/mail`);
    const mails = page2.getByTestId('caught-mail');
    await expect.poll(() => mails.filter({ hasText: '“Sugar Cube” is ready to ink' }).count()).toBe(1);
    expect(await mails.filter({ hasText: 'Ivo Sand mentioned you on “Sugar Cube”' }).count()).toBe(1);
    expect(await mails.filter({ hasText: '“Sugar Cube” is ready to ink' }).textContent()).toContain('To owner@quadrille.test');
  });

  it('a co-creator draws a stroke in that pass and the stamp is gone', async () => {
    const count = async () => Number((await page.getByTestId('pass-2-strokes').textContent())?.split(' ')[0]);
    const before = await count();
    await signIn(page2, baseUrl, 'cocreator@quadrille.test');
    await page2.goto(`${GAG}/passes/2`);
    const canvas = page2.getByTestId('sketch-canvas');
    await page2.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    // The editor says the pass is approved, and the first change asks first.
    await expect
      .poll(async () => page2.getByTestId('approval-note').textContent())
      .toMatch(/Approved: ready to ink\. Ivo Sand stamped pass 2 on .*, at revision \d+/);
    const b = (await canvas.boundingBox())!;
    const shown = await canvas.getAttribute('data-stroke-count');
    await page2.mouse.click(b.x + b.width * 0.3, b.y + b.height * 0.7);
    await page2.getByRole('dialog', { name: 'Pass 2 is approved' }).waitFor();
    expect(await canvas.getAttribute('data-stroke-count')).toBe(shown);
    await page2.getByRole('button', { name: 'Change this pass, clear the approval' }).click();
    await page2.mouse.move(b.x + b.width * 0.3, b.y + b.height * 0.7);
    await page2.mouse.down();
    for (let i = 1; i <= 8; i++) await page2.mouse.move(b.x + b.width * 0.3 + i * 6, b.y + b.height * 0.7 + i * 2);
    await page2.mouse.up();
    await page2.locator('[data-sync-state="saved"]').waitFor();
    // The editor, still on the gag page, sees it without reloading.
    await expect.poll(async () => page.getByTestId('current-stamp').textContent(), { timeout: 10_000 }).toContain('cleared');
    await expect.poll(async () => page.getByText('In review', { exact: true }).first().isVisible(), { timeout: 10_000 }).toBe(true);
    // …and the new stroke is in the pass's thumbnail count on the gag page.
    await expect.poll(count, { timeout: 10_000 }).toBe(before + 1);
  });
});
