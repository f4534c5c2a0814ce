// An approved pass is a fixed point (issue 15): opened by a co-creator it says who approved it, when
// and at which revision; the first press of the pen asks, and "keep the approval, continue in a copy"
// opens a new pass with the same strokes while the approved one and its stamp stay as they were.
import { describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const GAG_ID = 'demo-gag-06'; // ready to ink in the demo, its last pass stamped
const GAG = `${baseUrl}/series/demo-kettle-crab/gags/${GAG_ID}`;

type Stamp = { passId: string; passNumber: number; decision: string; clearedAt: string | null; by: string; passSeq: number };
const standing = async () =>
  (await page.evaluate(async (id) => (await (await fetch(`/api/gags/${id}/stamps`)).json()) as Stamp[], GAG_ID)).filter(
    (s) => s.decision === 'ready' && !s.clearedAt,
  );

describe('an approved pass in the editor', () => {
  it('asks before the first change, and a copy keeps the approval standing', async () => {
    await signIn(page, baseUrl, 'cocreator@quadrille.test');
    await page.goto(GAG);
    const [stamp] = await standing();
    expect(stamp).toBeDefined();
    await page.goto(`${GAG}/passes/${stamp!.passNumber}`);
    const canvas = page.locator('[data-testid="sketch-canvas"][data-loaded="true"]');
    await canvas.waitFor();
    const note = await page.getByTestId('approval-note').textContent();
    expect(note).toContain(`${stamp!.by} stamped pass ${stamp!.passNumber} on`);
    expect(note).toContain(`at revision ${stamp!.passSeq}`);
    const strokes = await canvas.getAttribute('data-stroke-count');

    // A press with the pen asks first, and draws nothing.
    const b = (await canvas.boundingBox())!;
    await page.mouse.move(b.x + b.width * 0.4, b.y + b.height * 0.4);
    await page.mouse.down();
    await page.mouse.move(b.x + b.width * 0.45, b.y + b.height * 0.45);
    await page.mouse.up();
    const dialog = page.getByRole('dialog', { name: `Pass ${stamp!.passNumber} is approved` });
    await dialog.waitFor();
    expect(await canvas.getAttribute('data-stroke-count')).toBe(strokes);

    await dialog.getByRole('button', { name: 'Keep the approval, continue in a copy' }).click();
    await page.waitForURL(new RegExp(`/passes/${stamp!.passNumber + 1}$`));
    const copy = page.locator('[data-testid="sketch-canvas"][data-loaded="true"]');
    await copy.waitFor();
    expect(await copy.getAttribute('data-stroke-count')).toBe(strokes);
    expect(await page.getByTestId('approval-note').count()).toBe(0);

    // The copy draws without asking; the approved pass and its stamp are untouched.
    const c = (await copy.boundingBox())!;
    await page.mouse.move(c.x + c.width * 0.4, c.y + c.height * 0.4);
    await page.mouse.down();
    for (let i = 1; i <= 6; i++) await page.mouse.move(c.x + c.width * 0.4 + i * 5, c.y + c.height * 0.4 + i * 3);
    await page.mouse.up();
    await expect.poll(() => copy.getAttribute('data-stroke-count')).toBe(String(Number(strokes) + 1));
    await page.locator('[data-sync-state="saved"]').waitFor();
    expect((await standing()).map((s) => s.passId)).toEqual([stamp!.passId]);
    const gag = await page.evaluate(async (id) => (await (await fetch(`/api/gags/${id}`)).json()) as { status: string }, GAG_ID);
    expect(gag.status).toBe('ready_to_ink');
  });
});
