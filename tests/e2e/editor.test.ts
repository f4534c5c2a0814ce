// The sketch editor in Chromium, as an artist uses it: draw with the mouse,
// see it saved, reload; draw offline and come back; two people in one pass.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const GAG = `${baseUrl}/series/demo-kettle-crab/gags/demo-gag-12`;
let passUrl = '';
let passId = '';

/** Drags a wavy line across a fraction of the canvas. */
async function drawStroke(p: Page, fx: number, fy: number, steps = 12) {
  const canvas = p.getByTestId('sketch-canvas');
  const box = (await canvas.boundingBox())!;
  const x0 = box.x + box.width * fx;
  const y0 = box.y + box.height * fy;
  await p.mouse.move(x0, y0);
  await p.mouse.down();
  for (let i = 1; i <= steps; i++) await p.mouse.move(x0 + i * 7, y0 + Math.sin(i / 2) * 8);
  await p.mouse.up();
}

async function dragBox(p: Page, fx: number, fy: number, wPx: number, hPx: number) {
  const box = (await p.getByTestId('sketch-canvas').boundingBox())!;
  const x0 = box.x + box.width * fx;
  const y0 = box.y + box.height * fy;
  await p.mouse.move(x0, y0);
  await p.mouse.down();
  for (let i = 1; i <= 6; i++) await p.mouse.move(x0 + (wPx * i) / 6, y0 + (hPx * i) / 6);
  await p.mouse.up();
}

const strokeCount = async (p: Page) => Number(await p.getByTestId('sketch-canvas').getAttribute('data-stroke-count'));
const syncState = (p: Page) => p.locator('[data-sync-state]').getAttribute('data-sync-state');

async function serverStrokes(p: Page): Promise<{ id: string }[]> {
  return p.evaluate(async (id) => (await (await fetch(`/api/passes/${id}`)).json()).strokes, passId);
}

beforeAll(async () => {
  await signIn(page, baseUrl, 'cocreator@quadrille.test');
});

describe('sketch editor', () => {
  it('starts a pass from the gag page', async () => {
    await page.goto(GAG);
    await page.getByRole('button', { name: 'New pass' }).click();
    await page.waitForURL(/\/passes\/1$/);
    passUrl = page.url();
    await page.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    await page.locator('[data-sync-state="saved"]').waitFor();
    passId = await page.evaluate(async () => {
      const gagId = location.pathname.split('/')[4];
      const passes = await (await fetch(`/api/gags/${gagId}/passes`)).json();
      return passes[0].id as string;
    });
    expect(passId).toBeTruthy();
  });

  it('draws three strokes with the mouse, says saved, and they survive a reload', async () => {
    await drawStroke(page, 0.3, 0.3);
    await drawStroke(page, 0.6, 0.35);
    await drawStroke(page, 0.35, 0.7);
    expect(await strokeCount(page)).toBe(3);
    await page.locator('[data-sync-state="saved"]').waitFor();
    expect((await serverStrokes(page)).length).toBe(3);
    await page.reload();
    await page.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    await expect.poll(() => strokeCount(page)).toBe(3);
  });

  it('keeps drawing offline and stores those strokes once when back online', async () => {
    await page.context().setOffline(true);
    await drawStroke(page, 0.62, 0.72);
    await drawStroke(page, 0.7, 0.75);
    await expect.poll(() => syncState(page), { timeout: 10_000 }).toBe('offline');
    expect(await page.locator('[data-sync-state]').textContent()).toMatch(/2 operations waiting/);
    // A reload while offline would lose nothing either: the outbox is on this device.
    const saved = await page.evaluate((id) => localStorage.getItem(`quadrille.outbox.${id}`), passId);
    expect(saved).toContain('"op":"add"');
    await page.context().setOffline(false);
    await expect.poll(() => syncState(page), { timeout: 20_000 }).toBe('saved');
    const strokes = await serverStrokes(page);
    expect(strokes.length).toBe(5);
    expect(new Set(strokes.map((s) => s.id)).size).toBe(5);
  });

  it('undo removes my last stroke; the eraser removes what it touches', async () => {
    await page.keyboard.press('Control+z');
    await expect.poll(() => strokeCount(page)).toBe(4);
    await page.getByRole('button', { name: 'Eraser (3)' }).click();
    await drawStroke(page, 0.3, 0.3, 6);
    await expect.poll(() => strokeCount(page)).toBe(3);
    await page.locator('[data-sync-state="saved"]').waitFor();
    expect((await serverStrokes(page)).length).toBe(3);
  });

  it('a balloon room drawn in a panel is saved with the pass', async () => {
    await page.keyboard.press('5');
    await dragBox(page, 0.55, 0.25, 90, 40);
    await expect.poll(async () => Number(await page.getByTestId('sketch-canvas').getAttribute('data-room-count'))).toBe(1);
    await page.locator('[data-sync-state="saved"]').waitFor();
    const rooms = await page.evaluate(async (id) => (await (await fetch(`/api/passes/${id}`)).json()).rooms, passId);
    expect(rooms).toHaveLength(1);
    expect(rooms[0].panel).toBe(1);

    // Drag the room by its middle: it moves, and the move is saved.
    const box = (await page.getByTestId('sketch-canvas').boundingBox())!;
    const cx = box.x + box.width * 0.55 + 45;
    const cy = box.y + box.height * 0.25 + 20;
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    for (let i = 1; i <= 6; i++) await page.mouse.move(cx + i * 5, cy + i * 2);
    await page.mouse.up();
    await expect
      .poll(async () => (await page.evaluate(async (id) => (await (await fetch(`/api/passes/${id}`)).json()).rooms, passId))[0].x, { timeout: 5_000 })
      .toBeGreaterThan(rooms[0].x + 3);
    expect(Number(await page.getByTestId('sketch-canvas').getAttribute('data-room-count'))).toBe(1);
  });
});

describe('lasso', () => {
  it('selects a stroke, copies it to another panel, and deletes the copy', async () => {
    await page.keyboard.press('1');
    await drawStroke(page, 0.27, 0.22, 5);
    const before = await strokeCount(page);
    await page.keyboard.press('4');
    const box = (await page.getByTestId('sketch-canvas').boundingBox())!;
    const at = (fx: number, fy: number) => [box.x + box.width * fx, box.y + box.height * fy] as const;
    const loop = [at(0.24, 0.17), at(0.4, 0.17), at(0.4, 0.28), at(0.24, 0.28), at(0.24, 0.17)];
    await page.mouse.move(...loop[0]!);
    await page.mouse.down();
    for (let i = 1; i < loop.length; i++) {
      const [x0, y0] = loop[i - 1]!;
      const [x1, y1] = loop[i]!;
      for (let k = 1; k <= 5; k++) await page.mouse.move(x0 + ((x1 - x0) * k) / 5, y0 + ((y1 - y0) * k) / 5);
    }
    await page.mouse.up();
    const selection = page.getByRole('group', { name: 'Selection' });
    await selection.getByText('1 selected').waitFor();
    await selection.getByRole('button', { name: '4 Payoff' }).click();
    await expect.poll(() => strokeCount(page)).toBe(before + 1);
    await page.locator('[data-sync-state="saved"]').waitFor();
    const copies = (await serverStrokes(page)) as unknown as { panel: number }[];
    expect(copies.filter((s) => s.panel === 3).length).toBeGreaterThanOrEqual(1);
    await page.keyboard.press('Delete');
    await expect.poll(() => strokeCount(page)).toBe(before);
    await page.locator('[data-sync-state="saved"]').waitFor();
    expect((await serverStrokes(page)).length).toBe(before);
  });
});

describe('two people in one pass', () => {
  let other: Awaited<ReturnType<typeof openBrowser>>;
  let page2: Page;
  beforeAll(async () => {
    other = await openBrowser();
    page2 = await other.context.newPage();
    await signIn(page2, baseUrl, 'owner@quadrille.test');
  });
  afterAll(async () => {
    await other?.close();
  });

  it('both end with the union of their strokes, without reloading', async () => {
    await page.goto(passUrl);
    await page2.goto(passUrl);
    await page.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    await page2.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    const start = await strokeCount(page);
    await expect.poll(() => strokeCount(page2)).toBe(start);
    await page.keyboard.press('1');
    await Promise.all([drawStroke(page, 0.3, 0.45), drawStroke(page2, 0.65, 0.45)]);
    await drawStroke(page2, 0.65, 0.8);
    await expect.poll(() => strokeCount(page), { timeout: 5_000 }).toBe(start + 3);
    await expect.poll(() => strokeCount(page2), { timeout: 5_000 }).toBe(start + 3);
    const a = (await serverStrokes(page)).map((s) => s.id).sort();
    const b = (await serverStrokes(page2)).map((s) => s.id).sort();
    expect(a).toEqual(b);
    expect(a).toHaveLength(start + 3);
  });
});
