// The board in Chromium at 1440 × 900: the page never scrolls sideways and every status
// column can be reached; a gag's card moves between columns by mouse and by keyboard
// within the allowed moves, a drop on "ready to ink" is refused with the reason, and
// each hand move shows in the activity. Uses its own gags, "Driftwood Raft" and "Rope Swing".
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, signIn } from './browser';

const baseUrl = inject('baseUrl');
const BOARD = `${baseUrl}/series/demo-kettle-crab`;
const STATUSES = ['Idea', 'Thumbnailing', 'In review', 'Ready to ink', 'Inked', 'Scanned', 'Placed'];
const STAMP_ONLY = '"Ready to ink" is set only by an editor\'s or owner\'s stamp on a pass.';

let browser: Awaited<ReturnType<typeof openBrowser>>;
let page: Page;

const columnOf = (title: string) =>
  page
    .getByRole('article')
    .filter({ has: page.getByRole('heading', { name: title, exact: true }) })
    .evaluate((el) => el.closest('section')?.getAttribute('aria-label'));
const said = () => page.locator('[id^="DndLiveRegion"]').textContent();
const notice = () => page.getByTestId('board-notice').textContent();

async function newGag(title: string) {
  await page.evaluate(async (t) => {
    const res = await fetch('/api/series/demo-kettle-crab/gags', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ title: t, premise: '' }),
    });
    if (!res.ok) throw new Error(`HTTP ${res.status}`);
  }, title);
}

/** Drags a card by the mouse onto a column, in small steps as a hand would (sideways, at the card's height). */
async function dragCard(title: string, column: string) {
  const card = page.getByRole('article').filter({ has: page.getByRole('heading', { name: title, exact: true }) });
  await card.scrollIntoViewIfNeeded();
  const a = (await card.boundingBox())!;
  const b = (await page.getByRole('region', { name: column, exact: true }).boundingBox())!;
  const [x0, y0] = [a.x + a.width / 2, a.y + 20];
  const [x1, y1] = [b.x + b.width / 2, Math.min(Math.max(y0, b.y + 40), b.y + b.height - 20)];
  await page.mouse.move(x0, y0);
  await page.mouse.down();
  for (let i = 1; i <= 15; i++) await page.mouse.move(x0 + ((x1 - x0) * i) / 15, y0 + ((y1 - y0) * i) / 15);
  await page.mouse.up();
}

beforeAll(async () => {
  browser = await openBrowser({ viewport: { width: 1440, height: 900 } });
  page = await browser.context.newPage();
  await signIn(page, baseUrl, 'owner@quadrille.test');
  await page.goto(BOARD);
  await newGag('Driftwood Raft');
  await newGag('Rope Swing');
  await page.goto(BOARD);
  await page.getByRole('heading', { name: 'Driftwood Raft' }).waitFor();
  // The cards become movable once the board's drag code has loaded (after the board is shown).
  await page.getByRole('button', { name: 'Move “Driftwood Raft” to another status' }).waitFor();
});
afterAll(async () => {
  await browser?.close();
});

describe('the board at 1440 px', () => {
  it('never scrolls the page sideways, and every column is reached by scrolling the columns alone', async () => {
    await page.getByText('Loading the activity and the volumes…').waitFor({ state: 'detached' });
    const width = () => page.evaluate(() => [document.documentElement.scrollWidth, window.innerWidth]);
    const [doc, win] = await width();
    expect(doc).toBeLessThanOrEqual(win!);
    // A keyboard user: Tab to the columns area, then the right arrow until it stops.
    const area = page.getByRole('region', { name: 'Gags by status' });
    await area.focus();
    const reached = new Set<string>();
    const look = async () => {
      for (const name of STATUSES) {
        const box = (await page.getByRole('region', { name, exact: true }).boundingBox())!;
        const frame = (await area.boundingBox())!;
        if (box.x >= frame.x - 1 && box.x + box.width <= Math.min(frame.x + frame.width, 1440) + 1) reached.add(name);
      }
    };
    await look();
    for (let i = 0; i < 80 && reached.size < STATUSES.length; i++) {
      await page.keyboard.press('ArrowRight');
      if (i % 5 === 4) await look();
    }
    await look();
    expect([...reached].sort()).toEqual([...STATUSES].sort());
    expect(await page.evaluate(() => window.scrollX)).toBe(0);
    expect((await width())[0]).toBeLessThanOrEqual(1440);
    await area.evaluate((el) => el.scrollTo({ left: 0 }));
  });
});

describe('moving a gag between columns', () => {
  it('by mouse: Idea → Thumbnailing, kept after a reload, without opening the gag', async () => {
    expect(await columnOf('Driftwood Raft')).toBe('Idea');
    await dragCard('Driftwood Raft', 'Thumbnailing');
    await expect.poll(() => columnOf('Driftwood Raft')).toBe('Thumbnailing');
    await expect.poll(notice).toBe('“Driftwood Raft” is now Thumbnailing.');
    expect(page.url()).toBe(BOARD);
    await page.reload();
    await page.getByRole('button', { name: 'Move “Driftwood Raft” to another status' }).waitFor();
    expect(await columnOf('Driftwood Raft')).toBe('Thumbnailing');
  });

  it('a mouse drop on "ready to ink" is refused with the reason, and nothing moves', async () => {
    await dragCard('Driftwood Raft', 'Ready to ink');
    await expect.poll(notice).toBe(`“Driftwood Raft” stays in Thumbnailing: ${STAMP_ONLY}`);
    expect(await columnOf('Driftwood Raft')).toBe('Thumbnailing');
    const stored = await page.evaluate(async () => {
      const gags = (await (await fetch('/api/series/demo-kettle-crab/gags')).json()) as { title: string; status: string }[];
      return gags.find((g) => g.title === 'Driftwood Raft')?.status;
    });
    expect(stored).toBe('thumbnailing');
  });

  it('by keyboard: the grip, arrows through the columns with each one announced, space to drop', async () => {
    await page.getByRole('button', { name: 'Move “Rope Swing” to another status' }).focus();
    // Each key, then what a screen reader hears (waited for, as a person would listen before the next key).
    const steps: [string, string][] = [
      ['Space', '“Rope Swing” is over its own column, Idea.'],
      ['ArrowRight', '“Rope Swing” would move to Thumbnailing.'],
      ['ArrowRight', '“Rope Swing” would move to In review.'],
      ['ArrowRight', `“Rope Swing” cannot go to Ready to ink: ${STAMP_ONLY}`],
      ['ArrowLeft', '“Rope Swing” would move to In review.'],
    ];
    for (const [key, heard] of steps) {
      await page.keyboard.press(key);
      await expect.poll(said).toBe(heard);
    }
    await page.keyboard.press('Space');
    await expect.poll(said).toBe('“Rope Swing” was moved to In review.');
    await expect.poll(() => columnOf('Rope Swing')).toBe('In review');
  });

  it('by keyboard onto "ready to ink": refused, said and shown, and it stays', async () => {
    await page.getByRole('button', { name: 'Move “Rope Swing” to another status' }).focus();
    await page.keyboard.press('Space');
    await expect.poll(said).toBe('“Rope Swing” is over its own column, In review.');
    await page.keyboard.press('ArrowRight');
    await expect.poll(said).toBe(`“Rope Swing” cannot go to Ready to ink: ${STAMP_ONLY}`);
    // The column itself says why while the card is over it.
    expect(await page.getByRole('region', { name: 'Ready to ink', exact: true }).textContent()).toContain(STAMP_ONLY);
    await page.keyboard.press('Space');
    await expect.poll(said).toBe(`“Rope Swing” stays in In review: ${STAMP_ONLY}`);
    await expect.poll(notice).toBe(`“Rope Swing” stays in In review: ${STAMP_ONLY}`);
    expect(await columnOf('Rope Swing')).toBe('In review');
  });

  it('each hand move is in the activity, without a reload', async () => {
    const feed = page.getByRole('region', { name: /activity/i });
    await expect.poll(() => feed.textContent(), { timeout: 10_000 }).toContain('moved “Rope Swing” from Idea to In review');
    expect(await feed.textContent()).toContain('moved “Driftwood Raft” from Idea to Thumbnailing');
  });
});
