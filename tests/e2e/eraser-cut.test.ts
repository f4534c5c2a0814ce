// The cutting eraser in Chromium (issue 15, found 3): a line crossed by the eraser becomes two
// pieces, saved as ops like any other, and still two after a reload.
import { describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();

describe('the cutting eraser', () => {
  it('cuts a drawn line in two where it passes, and the pieces are saved', async () => {
    await signIn(page, baseUrl, 'cocreator@quadrille.test');
    await page.goto(`${baseUrl}/series/demo-kettle-crab`);
    const gagId = await page.evaluate(async () => {
      const post = async (url: string, body: unknown) =>
        (await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) })).json();
      const gag = await post('/api/series/demo-kettle-crab/gags', { title: 'Crab cuts the line' });
      await post(`/api/gags/${gag.id}/passes`, {});
      return gag.id as string;
    });
    const url = `${baseUrl}/series/demo-kettle-crab/gags/${gagId}/passes/1`;
    await page.goto(url);
    const canvas = page.locator('[data-testid="sketch-canvas"][data-loaded="true"]');
    await canvas.waitFor();
    const b = (await canvas.boundingBox())!;
    // A horizontal line across the top-left panel.
    const y = b.y + b.height * 0.3;
    await page.mouse.move(b.x + b.width * 0.2, y);
    await page.mouse.down();
    for (let i = 1; i <= 12; i++) await page.mouse.move(b.x + b.width * 0.2 + i * 8, y);
    await page.mouse.up();
    await expect.poll(() => canvas.getAttribute('data-stroke-count')).toBe('1');

    await page.getByRole('button', { name: 'Eraser (3)' }).click();
    await page.getByRole('button', { name: 'Cut strokes where it passes' }).click();
    const x = b.x + b.width * 0.2 + 48;
    await page.mouse.move(x, y - 20);
    await page.mouse.down();
    for (let i = 1; i <= 8; i++) await page.mouse.move(x, y - 20 + i * 5);
    await page.mouse.up();
    await expect.poll(() => canvas.getAttribute('data-stroke-count')).toBe('2');
    await page.locator('[data-sync-state="saved"]').waitFor();

    await page.reload();
    await canvas.waitFor();
    expect(await canvas.getAttribute('data-stroke-count')).toBe('2');
  });
});
