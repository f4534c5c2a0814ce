// Issue 15, found 5 and 6, in Chromium: an editor reviews a gag's second pass — findings and checklist
// above the stamp, the first pass's ticks carried as "to re-check", a stamp over red findings asked
// first — then mentions two members through the "@" list (keyboard and mouse) and one nobody has as a
// name; the owner's board hears of a status moved by hand in its activity panel, without a reload.
// Its own gag, "Shell Swap", made here with two blank passes.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage(); // the editor
const SERIES = `${baseUrl}/series/demo-kettle-crab`;
let gagUrl = '';

let owner: Awaited<ReturnType<typeof openBrowser>>;
let board: Page;
beforeAll(async () => {
  owner = await openBrowser();
  board = await owner.context.newPage();
  await signIn(board, baseUrl, 'owner@quadrille.test');
  // The owner starts the gag and two passes, as the board and the gag page would.
  const gag = await board.request.post(`${SERIES.replace(baseUrl, `${baseUrl}/api`)}/gags`, {
    data: { title: 'Shell Swap', premise: 'Kettle tries on a bigger shell; the teapot wins.' },
  });
  expect(gag.status()).toBe(201);
  const { id } = (await gag.json()) as { id: string };
  for (let i = 0; i < 2; i++) expect((await board.request.post(`${baseUrl}/api/gags/${id}/passes`, { data: {} })).status()).toBe(201);
  gagUrl = `${SERIES}/gags/${id}`;
  await signIn(page, baseUrl, 'editor@quadrille.test');
});
afterAll(async () => {
  await owner?.close();
});

describe('the review of a pass', () => {
  it('shows the findings and the checklist before the stamp', async () => {
    await page.goto(gagUrl);
    const review = page.locator('section[aria-labelledby="review-title"]');
    await review.getByRole('heading', { name: 'Stamp' }).waitFor();
    // The findings are measured after the page loads (in the worker pool): wait for their card too.
    await review.locator('h3', { hasText: 'Findings' }).first().waitFor();
    await review.locator('h3', { hasText: 'Silent-read checklist' }).first().waitFor();
    const headings = (await review.locator('h3').allTextContents()).map((h) => h.trim());
    const at = (name: string) => headings.findIndex((h) => h.includes(name));
    expect(at('Findings')).toBeGreaterThanOrEqual(0);
    expect(at('Findings')).toBeLessThan(at('Silent-read checklist'));
    expect(at('Silent-read checklist')).toBeLessThan(at('Stamp'));
  });

  it('carries the ticks of pass 1 to pass 2 as "to re-check", until each is ticked again', async () => {
    const checklist = page.getByRole('region', { name: 'Silent-read checklist' });
    await page.getByLabel('Pass under review').selectOption({ label: 'Pass 1' });
    const boxes = checklist.getByRole('checkbox');
    await expect.poll(() => boxes.count()).toBeGreaterThan(2);
    const items = await boxes.count();
    await boxes.nth(0).click();
    await checklist.getByText(`1 of ${items} ticked`).waitFor();
    await boxes.nth(1).click();
    await checklist.getByText(`2 of ${items} ticked`).waitFor();

    await page.getByLabel('Pass under review').selectOption({ label: 'Pass 2' });
    await checklist.getByText(`0 of ${items} ticked`).waitFor();
    await checklist.getByText(`Pass 1 had 2 of ${items} ticked.`).waitFor();
    await checklist.getByRole('button', { name: 'Carry them as “to re-check”' }).click();
    // A state of its own, in words: the checkbox is not ticked, and says why it is marked.
    const marked = checklist.getByRole('checkbox', { name: /To re-check: ticked on pass 1/ });
    await expect.poll(() => marked.count()).toBe(2);
    expect(await marked.first().isChecked()).toBe(false);
    await checklist.getByText(`0 of ${items} ticked · 2 to re-check`).waitFor();
    await marked.first().click();
    await checklist.getByText(`1 of ${items} ticked · 1 to re-check`).waitFor();
    expect(await checklist.getByTestId('recheck-mark').count()).toBe(1);
    // The offer is gone once the pass has ticks of its own.
    expect(await checklist.getByRole('button', { name: /Carry them/ }).count()).toBe(0);
  });

  it('asks before stamping "ready to ink" over red findings, and cancelling stamps nothing', async () => {
    const stamp = page.getByRole('button', { name: 'Stamp “ready to ink”', exact: true });
    await expect.poll(() => stamp.isEnabled()).toBe(true);
    await stamp.click();
    const ask = page.getByRole('dialog');
    await ask.waitFor();
    expect(await ask.getByRole('heading').textContent()).toMatch(/^Stamp pass 2 “ready to ink” over \d+ findings\?$/);
    const listed = await ask.getByTestId('stamp-findings').textContent();
    expect(listed).toContain('Panel 1 (Setup) is empty.');
    expect(listed).toContain('Beats without a note: Setup, Build, Turn, Payoff.');
    await ask.getByRole('button', { name: 'Cancel' }).click();
    await expect.poll(() => ask.isVisible()).toBe(false);
    await page.getByText('Pass 2 has not been stamped.').waitFor();

    await stamp.click();
    await ask.getByRole('button', { name: 'Stamp “ready to ink” anyway' }).click();
    await expect.poll(async () => page.getByTestId('current-stamp').textContent()).toContain('Ready to ink');
  });
});

describe('mentions', () => {
  it('"@" offers the members: picked with the keyboard or the mouse; one that names nobody is said before and after posting', async () => {
    const box = page.getByLabel('Comment', { exact: true });
    await box.click();
    await box.pressSequentially('Over to @');
    const list = page.getByRole('listbox', { name: 'Members to mention' });
    await list.waitFor();
    const names = await list.getByRole('option').allTextContents();
    expect(names.some((n) => n.startsWith('Nell Harrow'))).toBe(true);
    expect(names.some((n) => n.startsWith('Ivo Sand'))).toBe(false); // not oneself
    await box.pressSequentially('Ne');
    await expect.poll(() => list.getByRole('option').count()).toBe(1);
    // The box points at the chosen option, as a screen reader follows it.
    const active = await box.getAttribute('aria-activedescendant');
    expect(await page.locator(`[id="${active}"]`).getAttribute('aria-selected')).toBe('true');
    await page.keyboard.press('Enter');
    await expect.poll(() => box.inputValue()).toBe('Over to @Nell ');

    await box.pressSequentially('and @Ta');
    await list.getByRole('option', { name: /Tam Quill/ }).click();
    await expect.poll(() => box.inputValue()).toBe('Over to @Nell and @Tam ');

    await box.pressSequentially('and @Bosun, the shell is too big.');
    await expect.poll(() => list.isVisible()).toBe(false);
    const warning = page.getByTestId('mention-warning');
    expect(await warning.textContent()).toBe('@Bosun matches nobody in this series — no one is told for it.');
    await page.getByRole('button', { name: 'Post comment' }).click();
    await page.getByRole('alert').filter({ hasText: 'Not posted yet' }).waitFor();
    await page.getByRole('button', { name: 'Post anyway' }).click();
    const outcome = page.getByTestId('mention-outcome');
    await outcome.waitFor();
    const said = await outcome.textContent();
    expect(said).toContain('Nell Harrow');
    expect(said).toContain('@Bosun matches nobody in this series');
    await page.getByTestId('comment-thread').filter({ hasText: 'the shell is too big' }).waitFor();
  });

  it('the mention e-mail links to where notifications are turned off', async () => {
    await board.goto(`${baseUrl}/dev/mail`);
    const mail = board.getByTestId('caught-mail').filter({ hasText: 'Ivo Sand mentioned you on “Shell Swap”' }).filter({ hasText: 'To owner@' });
    await expect.poll(() => mail.count()).toBe(1);
    const text = (await mail.textContent()) ?? '';
    const link = /https?:\/\/\S+\/members#notifications/.exec(text)?.[0];
    expect(link).toBe(`${SERIES}/members#notifications`);
    await board.goto(link!);
    await board
      .locator('#notifications')
      .getByRole('checkbox', { name: /E-mail me when I am mentioned/ })
      .waitFor();
  });
});

describe('the board’s activity panel', () => {
  it('shows a status moved by hand on another page, without a reload', async () => {
    await board.goto(SERIES);
    const activity = board.getByTestId('activity');
    await activity.waitFor();
    const gagPage = await owner.context.newPage();
    await gagPage.goto(gagUrl);
    await gagPage.getByLabel('Status', { exact: true }).selectOption('in_review');
    await expect.poll(() => activity.textContent(), { timeout: 10_000 }).toContain('Nell Harrow moved “Shell Swap” from Ready to ink to In review');
    await gagPage.close();
  });
});
