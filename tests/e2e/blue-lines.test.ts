// Blue-line sheets from the volume page, as a person picks them: the gags ready to ink are
// chosen at first, only the sizes that fit (or tiled ones) are offered, and the download
// holds one sheet per chosen gag (two per gag when tiled). Reads the demo volume only.
import { execFileSync } from 'node:child_process';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const VOLUME = `${baseUrl}/series/demo-kettle-crab/volumes/demo-volume-low-tide`;

beforeAll(async () => {
  await signIn(page, baseUrl, 'viewer@quadrille.test');
});

describe('blue-line sheets on the volume page', () => {
  it('offers the sizes that fit and the tiled ones, starts from the ready gags, and downloads the sheets chosen', async () => {
    await page.goto(VOLUME);
    const form = page.getByRole('group', { name: 'Blue-line sheets for the drawing desk' });
    const size = form.getByLabel('Size on paper');
    await size.waitFor();
    const offered = await size.locator('option').allTextContents();
    // 150 mm + 2 × 3 mm bleed at 200 % is 312 mm, wider than A3 (297 mm): offered only tiled.
    expect(offered).toEqual([
      '100 % on A4',
      '100 % on A3',
      '150 % on A4, tiled on 2 sheets a page',
      '150 % on A3',
      '200 % on A4, tiled on 4 sheets a page',
      '200 % on A3, tiled on 2 sheets a page',
    ]);
    // The gags ready to ink (a standing stamp) are chosen at first; other tests may have placed more gags in
    // the running order by now, so the figures come from the volume's own answer.
    const offer = await page.evaluate(
      async () =>
        (await (await fetch('/api/volumes/demo-volume-low-tide/export/templates')).json()) as { gags: { gagId: string }[]; defaults: string[] },
    );
    const boxes = form.getByRole('checkbox');
    expect(await boxes.count()).toBe(offer.gags.length);
    let checked = 0;
    for (let i = 0; i < offer.gags.length; i++) if (await boxes.nth(i).isChecked()) checked++;
    expect(checked).toBe(offer.defaults.length);
    expect(offer.defaults).toEqual(expect.arrayContaining(['demo-gag-01', 'demo-gag-02', 'demo-gag-03', 'demo-gag-05', 'demo-gag-06']));
    await form.getByRole('checkbox', { name: /Low Tide Lunch/ }).uncheck();
    await form.getByRole('checkbox', { name: /Lid Umbrella/ }).uncheck();
    const sheets = (offer.defaults.length - 2) * 2;
    await size.selectOption({ label: '150 % on A4, tiled on 2 sheets a page' });
    await form.getByLabel('Guide lines').selectOption({ label: 'Grey' });
    await expect.poll(() => form.getByTestId('blue-line-count').textContent()).toMatch(new RegExp(`^${sheets} sheets, each page cut across 2`));
    const downloading = page.waitForEvent('download');
    await form.getByRole('button', { name: 'Blue-line sheets (PDF)' }).click();
    const file = await downloading;
    expect(file.suggestedFilename()).toBe('blue-lines-150-A4.pdf');
    const saved = (await file.path())!;
    const info = execFileSync('pdfinfo', [saved], { encoding: 'utf8' });
    expect(Number(info.match(/^Pages:\s+(\d+)/m)![1])).toBe(sheets);
    // Tiled on A4 turned landscape (ISO 216: 297 × 210 mm = 841.89 × 595.28 pt).
    expect(info).toMatch(/Page size:\s+841\.89 x 595\.2\d/);
    const text = execFileSync('pdftotext', [saved, '-'], { encoding: 'utf8' });
    expect(text).not.toMatch(/Low Tide Lunch/);
    expect(text).toMatch(/Spout Periscope/);
  });
});
