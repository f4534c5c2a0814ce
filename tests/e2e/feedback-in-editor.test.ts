// Feedback where the drawing happens (issue 15, found 2): a comment pinned to a beat shows on the
// beat's card and under the beat in the editor; an open point comment of pass 1 is offered in pass 2,
// marked as from pass 1; the pin tool's comment box opens beside the pin, in view, and says where the
// point is as a position.
import { describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();

describe('feedback in the editor', () => {
  it('beat comments, comments of earlier passes and the pin box beside the pin', async () => {
    await signIn(page, baseUrl, 'cocreator@quadrille.test');
    await page.goto(`${baseUrl}/series/demo-kettle-crab`);
    // A gag of its own, so no other test's comments or passes are in the way.
    const gagId = await page.evaluate(async () => {
      const json = async (url: string, body: unknown) => {
        const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
        if (!res.ok) throw new Error(`${url}: ${res.status} ${await res.text()}`);
        return res.json();
      };
      const gag = await json('/api/series/demo-kettle-crab/gags', { title: 'Crab and the tide clock' });
      const pass = await json(`/api/gags/${gag.id}/passes`, {});
      await json(`/api/gags/${gag.id}/comments`, { body: 'The turn needs the clock face bigger.', target: 'beat', beat: 'turn' });
      await json(`/api/gags/${gag.id}/comments`, {
        body: 'Move the crab left of the gull here.',
        target: 'point',
        passId: pass.id,
        panel: 2,
        x: 30,
        y: 110,
      });
      await json(`/api/gags/${gag.id}/passes`, { copyFrom: 1 });
      return gag.id as string;
    });

    await page.goto(`${baseUrl}/series/demo-kettle-crab/gags/${gagId}`);
    const turn = page.getByRole('list', { name: 'Comments on the turn beat' });
    await turn.waitFor();
    expect(await turn.textContent()).toContain('The turn needs the clock face bigger.');

    await page.goto(`${baseUrl}/series/demo-kettle-crab/gags/${gagId}/passes/2`);
    const canvas = page.locator('[data-testid="sketch-canvas"][data-loaded="true"]');
    await canvas.waitFor();
    expect(await page.getByRole('list', { name: 'Comments on the turn beat' }).textContent()).toContain('clock face bigger');
    const earlier = page.getByTestId('earlier-pins');
    await earlier.waitFor();
    expect(await earlier.textContent()).toMatch(/A from pass 1, panel 3: .*Move the crab left of the gull here\./);

    // The pin box opens beside the pin, inside the window.
    await page.getByRole('button', { name: 'Pin a comment' }).click();
    const b = (await canvas.boundingBox())!;
    const at = { x: b.x + b.width * 0.6, y: b.y + b.height * 0.55 };
    await page.mouse.click(at.x, at.y);
    const box = page.getByTestId('pin-composer');
    await box.waitFor();
    const where = (await box.boundingBox())!;
    const viewport = page.viewportSize()!;
    expect(where.y + where.height).toBeLessThanOrEqual(viewport.height);
    expect(Math.min(Math.abs(where.x - at.x), Math.abs(where.x + where.width - at.x))).toBeLessThan(60);
    expect(Math.abs(where.y - at.y)).toBeLessThan(220);
    expect(await box.textContent()).toMatch(/mm from the trim’s left edge, [\d.]+ mm down from its top/);
    await box.getByRole('textbox', { name: 'Comment on this point' }).fill('Gull could look back here.');
    await box.getByRole('button', { name: 'Post' }).click();
    await box.waitFor({ state: 'detached' });
    await page.getByText('Gull could look back here.').first().waitFor();
  });
});
