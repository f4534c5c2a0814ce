// The editor on a tablet held upright (820 × 1180, touch), as an artist sketches:
// the page is the largest thing on screen, nothing overlaps, the side panels open
// as a drawer, and a stroke drawn with a pen (pen-type pointer events) lands in
// the panel it was drawn in.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, signIn } from './browser';

const baseUrl = inject('baseUrl');
const VIEWPORT = { width: 820, height: 1180 };
let browser: Awaited<ReturnType<typeof openBrowser>>;
let page: Page;
let passId = '';

type Box = { x: number; y: number; width: number; height: number; what: string };

/** Every visible control's box, and where two of them overlap (nested controls aside). */
async function overlappingControls(p: Page): Promise<string[]> {
  const boxes: Box[] = await p.evaluate(() => {
    const els = [...document.querySelectorAll<HTMLElement>('button, select, input, a[href], [role="status"], textarea')];
    return els
      .filter((el) => {
        const r = el.getBoundingClientRect();
        const s = getComputedStyle(el);
        if (!(r.width > 0 && r.height > 0 && s.visibility !== 'hidden' && r.bottom > 0 && r.top < innerHeight && r.right > 0 && r.left < innerWidth))
          return false;
        // Only what a finger can reach: a control under the open drawer is covered, not overlapping.
        const hit = document.elementFromPoint(
          Math.min(innerWidth - 1, Math.max(0, r.left + r.width / 2)),
          Math.min(innerHeight - 1, Math.max(0, r.top + r.height / 2)),
        );
        return !!hit && (el === hit || el.contains(hit) || hit.contains(el));
      })
      .filter((el) => (!el.closest('[hidden]') && !el.closest('aside:not([class*="fixed"])')) || !!el.closest('aside[class*="fixed"]'))
      .map((el) => {
        const r = el.getBoundingClientRect();
        // The visible part only: a strip that scrolls sideways clips what it holds.
        let clip = { left: 0, top: 0, right: innerWidth, bottom: innerHeight };
        for (let a = el.parentElement; a; a = a.parentElement) {
          const s = getComputedStyle(a);
          if (s.overflowX !== 'visible' || s.overflowY !== 'visible') {
            const c = a.getBoundingClientRect();
            clip = {
              left: Math.max(clip.left, c.left),
              top: Math.max(clip.top, c.top),
              right: Math.min(clip.right, c.right),
              bottom: Math.min(clip.bottom, c.bottom),
            };
          }
        }
        const x = Math.max(r.left, clip.left);
        const y = Math.max(r.top, clip.top);
        return {
          x,
          y,
          width: Math.min(r.right, clip.right) - x,
          height: Math.min(r.bottom, clip.bottom) - y,
          what: `${el.tagName.toLowerCase()} "${(el.getAttribute('aria-label') ?? el.textContent ?? '').trim().slice(0, 30)}"`,
        };
      })
      .filter((b) => b.width > 0 && b.height > 0);
  });
  const hits: string[] = [];
  for (let i = 0; i < boxes.length; i++) {
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i]!;
      const b = boxes[j]!;
      const ix = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
      const iy = Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y);
      const nested = ix >= Math.min(a.width, b.width) - 1 && iy >= Math.min(a.height, b.height) - 1;
      if (ix > 1 && iy > 1 && !nested) hits.push(`${a.what} × ${b.what}`);
    }
  }
  return hits;
}

beforeAll(async () => {
  browser = await openBrowser({ viewport: VIEWPORT, hasTouch: true });
  page = await browser.context.newPage();
  await signIn(page, baseUrl, 'cocreator@quadrille.test');
  const made = await page.evaluate(async () =>
    (await fetch('/api/gags/demo-gag-10/passes', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' })).json(),
  );
  passId = made.id;
  await page.goto(`${baseUrl}/series/demo-kettle-crab/gags/demo-gag-10/passes/${made.number}`);
  await page.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
});

afterAll(async () => {
  await browser?.close();
});

describe('the editor at 820 × 1180 with touch', () => {
  it('gives the page most of the screen, with the side panels folded away', async () => {
    const canvas = (await page.getByTestId('sketch-canvas').boundingBox())!;
    expect(canvas.width).toBeGreaterThan(VIEWPORT.width * 0.9);
    expect(canvas.height).toBeGreaterThan(VIEWPORT.height * 0.6);
    expect(await page.getByRole('complementary', { name: 'Beats, review and revisions' }).isVisible()).toBe(false);
  });

  it('has no control over another', async () => {
    expect(await overlappingControls(page)).toEqual([]);
  });

  it('a pen stroke drawn in the upper right lands in panel 2 (build)', async () => {
    const box = (await page.getByTestId('sketch-canvas').boundingBox())!;
    // The page is centred in the canvas: 70 % across and 35 % down is inside the upper right panel.
    const x0 = box.x + box.width * 0.62;
    const y0 = box.y + box.height * 0.35;
    const cdp = await page.context().newCDPSession(page);
    const pen = (type: 'mousePressed' | 'mouseMoved' | 'mouseReleased', x: number, y: number, force: number) =>
      cdp.send('Input.dispatchMouseEvent', {
        type,
        x,
        y,
        button: 'left',
        buttons: type === 'mouseReleased' ? 0 : 1,
        clickCount: 1,
        pointerType: 'pen',
        force,
      });
    await pen('mousePressed', x0, y0, 0.4);
    for (let i = 1; i <= 12; i++) await pen('mouseMoved', x0 + i * 4, y0 + i * 2, 0.4 + i * 0.03);
    await pen('mouseReleased', x0 + 48, y0 + 24, 0);
    await expect.poll(async () => Number(await page.getByTestId('sketch-canvas').getAttribute('data-stroke-count'))).toBe(1);
    await page.locator('[data-sync-state="saved"]').waitFor();
    const strokes = await page.evaluate(async (id) => (await (await fetch(`/api/passes/${id}`)).json()).strokes, passId);
    expect(strokes).toHaveLength(1);
    expect(strokes[0].panel).toBe(1);
    // A pen has pressure: it rose along the stroke, so not every point has the mouse's fixed 0.5.
    expect(new Set(strokes[0].points.map((p: number[]) => p[2])).size).toBeGreaterThan(1);
  });

  it('opens the side panels as a drawer, and closes it again', async () => {
    await page.getByRole('button', { name: 'Panels' }).click();
    const drawer = page.getByRole('complementary', { name: 'Beats, review and revisions' });
    await drawer.getByRole('heading', { name: 'Beats' }).waitFor();
    expect(await overlappingControls(page)).toEqual([]);
    await page.getByRole('button', { name: 'Close panels' }).click();
    expect(await drawer.isVisible()).toBe(false);
  });
});
