// A gag's status and its stamp marks follow every change on every open page,
// without a reload: the owner keeps the board, the gag page and the volume open in
// three tabs while the editor stamps in another browser, a change clears the stamp
// and the owner moves the gag by hand. Uses its own gag, "Kelp Ladder".
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, signIn } from './browser';
import { passFilledFrom } from '../support/heavy-pass';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const SERIES = `${baseUrl}/series/demo-kettle-crab`;
const TITLE = 'Kelp Ladder';
const stroke = (id: string, y: number) => ({
  id,
  panel: 0,
  tool: 'pen' as const,
  grey: 100,
  size: 0.6,
  points: [[12, y, 0.5] as [number, number, number], [40, y + 6, 0.5] as [number, number, number]],
});

let editor: Awaited<ReturnType<typeof openBrowser>>;
let editorPage: Page;
let board: Page;
let volume: Page;
let gagId: string;
let passId: string;

/** The gag's card on the board, and the status column it sits in. */
const card = () => board.getByRole('article').filter({ has: board.getByRole('heading', { name: TITLE }) });
const columnOf = () => card().evaluate((el) => el.closest('section')?.getAttribute('aria-label'));
const unplacedBadge = () => volume.getByRole('listitem').filter({ hasText: TITLE }).locator('span.rounded-full');
const badge = () => page.locator('span.rounded-full', { hasText: /^(✓)?(Idea|Thumbnailing|In review|Ready to ink|Inked)$/ }).first();

beforeAll(async () => {
  await signIn(page, baseUrl, 'owner@quadrille.test');
  await page.goto(SERIES);
  gagId = await page.evaluate(async (title) => {
    const res = await fetch('/api/series/demo-kettle-crab/gags', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ title, premise: 'Kettle climbs the kelp to reach the pier.' }),
    });
    return ((await res.json()) as { id: string }).id;
  }, TITLE);
  passId = (await passFilledFrom(page, gagId, [stroke('k1', 20)], 'kelp')).id;
  // Three tabs of one person: the gag page (this one), the board, the volume.
  board = await page.context().newPage();
  volume = await page.context().newPage();
  await board.goto(SERIES);
  await volume.goto(`${SERIES}/volumes/demo-volume-low-tide`);
  await page.goto(`${SERIES}/gags/${gagId}`);
  await card().waitFor();
  await unplacedBadge().waitFor();
  await page.getByTestId('pass-card-1').waitFor();
  editor = await openBrowser();
  editorPage = await editor.context.newPage();
  await signIn(editorPage, baseUrl, 'editor@quadrille.test');
});
afterAll(async () => {
  await editor?.close();
});

describe('status and stamp marks, live on every open page', () => {
  it('the editor stamps pass 1 "ready to ink": the pass card, the board card and the volume follow, in the stamp colour', async () => {
    await editorPage.goto(`${SERIES}/gags/${gagId}`);
    await editorPage.getByRole('button', { name: 'Stamp “ready to ink”' }).click();
    // Panels 2–4 are empty (red findings): the stamp asks first.
    await editorPage.getByRole('button', { name: 'Stamp “ready to ink” anyway' }).click();
    await editorPage.getByTestId('current-stamp').filter({ hasText: 'Ready to ink' }).waitFor();

    const passMark = page.getByTestId('pass-card-1').getByTestId('stamp-mark');
    await expect.poll(() => passMark.getAttribute('data-stamp'), { timeout: 10_000 }).toBe('ready');
    await expect.poll(() => badge().textContent()).toBe('✓Ready to ink');
    await expect.poll(() => card().getByTestId('stamp-mark').textContent(), { timeout: 10_000 }).toBe('✓Ready to ink · pass 1');
    await expect.poll(columnOf).toBe('Ready to ink');
    await expect.poll(() => unplacedBadge().textContent(), { timeout: 10_000 }).toBe('✓Ready to ink');

    // The mark is not the error red (#b8321f, the colour of every error message); it is the stamp green #24603a.
    const colours = await passMark.evaluate((el) => [getComputedStyle(el).color, getComputedStyle(el).borderColor]);
    expect(colours).toEqual(['rgb(36, 96, 58)', 'rgb(36, 96, 58)']);
    // The status badge "ready to ink" wears it too.
    const cardBadge = card().locator('span.rounded-full', { hasText: 'Ready to ink' });
    expect(await cardBadge.evaluate((el) => getComputedStyle(el).color)).toBe('rgb(36, 96, 58)');
    const stampButton = await editorPage.getByRole('button', { name: 'Stamp “ready to ink”' }).evaluate((el) => getComputedStyle(el).backgroundColor);
    expect(stampButton).toBe('rgb(36, 96, 58)');
  });

  it('a change to the approved pass clears the stamp: "in review" and a cleared mark everywhere', async () => {
    await page.evaluate(
      async ({ id, op }) => {
        const res = await fetch(`/api/passes/${id}/ops`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ batchId: 'kelp-clear', ops: [op] }),
        });
        if (!res.ok) throw new Error(`HTTP ${res.status}`);
      },
      { id: passId, op: { op: 'add', stroke: stroke('k2', 40) } },
    );
    await expect
      .poll(() => page.getByTestId('pass-card-1').getByTestId('stamp-mark').getAttribute('data-stamp'), { timeout: 10_000 })
      .toBe('cleared');
    await expect.poll(() => badge().textContent()).toBe('In review');
    await expect.poll(() => card().getByTestId('stamp-mark').textContent(), { timeout: 10_000 }).toBe('“Ready” stamp cleared · pass 1');
    await expect.poll(columnOf).toBe('In review');
    await expect.poll(() => unplacedBadge().textContent(), { timeout: 10_000 }).toBe('In review');
    // The editor, who stamped it, sees it cleared too.
    await expect.poll(() => editorPage.getByTestId('current-stamp').textContent(), { timeout: 10_000 }).toContain('cleared');
  });

  it('"needs another pass" marks the pass sent back; a hand move reaches the board and the volume', async () => {
    await editorPage.getByRole('button', { name: 'Needs another pass' }).click();
    await expect.poll(() => page.getByTestId('pass-card-1').getByTestId('stamp-mark').getAttribute('data-stamp'), { timeout: 10_000 }).toBe('again');
    await expect.poll(() => card().getByTestId('stamp-mark').textContent(), { timeout: 10_000 }).toBe('↩Sent back · pass 1');
    await expect.poll(columnOf).toBe('Thumbnailing');
    // The owner moves it by hand on the gag page; the other tabs follow.
    await page.getByLabel('Status', { exact: true }).selectOption({ label: 'Move to In review' });
    await expect.poll(() => badge().textContent()).toBe('In review');
    await expect.poll(columnOf, { timeout: 10_000 }).toBe('In review');
    await expect.poll(() => unplacedBadge().textContent(), { timeout: 10_000 }).toBe('In review');
    await expect.poll(() => editorPage.getByText('In review', { exact: true }).first().isVisible(), { timeout: 10_000 }).toBe(true);
  });
});
