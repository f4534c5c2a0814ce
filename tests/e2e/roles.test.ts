// Each demo role signs in through the real sign-in page and sees what the role allows.
import { describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();

const KETTLE = `${baseUrl}/series/demo-kettle-crab`;
const GAG = `${KETTLE}/gags/demo-gag-07`;

describe.each([
  { email: 'owner@quadrille.test', role: 'Owner', canEdit: true, canDelete: true },
  { email: 'cocreator@quadrille.test', role: 'Co-creator', canEdit: true, canDelete: false },
  { email: 'editor@quadrille.test', role: 'Editor', canEdit: false, canDelete: false },
  { email: 'viewer@quadrille.test', role: 'Viewer', canEdit: false, canDelete: false },
])('$role', ({ email, role, canEdit, canDelete }) => {
  it('sees Kettle Crab with the role in the series list', async () => {
    await signIn(page, baseUrl, email);
    const card = page.getByRole('link', { name: /Kettle Crab/ });
    await card.waitFor();
    expect(await card.textContent()).toContain(`Your role: ${role}`);
    expect(await page.getByRole('link', { name: /Lantern Moth/ }).count()).toBe(0);
  });

  it(`the board ${canEdit ? 'offers' : 'does not offer'} a new gag form`, async () => {
    await page.goto(KETTLE);
    await page.getByRole('heading', { name: 'Kettle Crab' }).waitFor();
    expect(await page.getByTestId('my-role').textContent()).toBe(role);
    // Every status column is on the board, with the demo gags in them.
    for (const col of ['Idea', 'Thumbnailing', 'In review', 'Ready to ink', 'Inked', 'Scanned', 'Placed']) {
      expect(await page.getByRole('region', { name: col, exact: true }).count()).toBe(1);
    }
    await page.getByRole('link', { name: 'Sugar Cube', exact: true }).waitFor();
    // The form loads after the board is shown.
    await expect.poll(() => page.getByRole('form', { name: 'New gag' }).count()).toBe(canEdit ? 1 : 0);
    // Cards move between columns only for those who may move gags (their grips come with the drag code).
    const grips = page.getByRole('button', { name: /^Move “.+” to another status$/ });
    if (canEdit) await grips.first().waitFor();
    else expect(await grips.count()).toBe(0);
  });

  it(`the gag page is ${canEdit ? 'editable' : 'read-only'}`, async () => {
    await page.goto(GAG);
    await page.getByRole('heading', { name: 'The four beats' }).waitFor();
    expect(await page.locator('textarea[id^="beat-"]').count()).toBe(canEdit ? 4 : 0);
    expect(await page.getByLabel('Title', { exact: true }).count()).toBe(canEdit ? 1 : 0);
    expect(await page.getByRole('button', { name: 'Delete gag' }).count()).toBe(canDelete ? 1 : 0);
    // The notes are readable either way.
    expect(await page.content()).toContain('Kettle carries it home above his head like a trophy.');
    // Passes are shown as thumbnails; only drafting roles may start one.
    expect(await page.getByRole('link', { name: /Open pass 1/ }).count()).toBe(1);
    expect(await page.getByRole('button', { name: 'New pass' }).count()).toBe(canEdit ? 1 : 0);
  });

  it(`the sketch editor ${canEdit ? 'offers the drawing tools' : 'opens read-only'}`, async () => {
    await page.goto(`${GAG}/passes/1`);
    const canvas = page.getByTestId('sketch-canvas');
    await page.locator('[data-testid="sketch-canvas"][data-loaded="true"]').waitFor();
    expect(Number(await canvas.getAttribute('data-stroke-count'))).toBeGreaterThan(10);
    expect(await page.getByRole('button', { name: 'Pen (1)' }).count()).toBe(canEdit ? 1 : 0);
    expect(await page.getByRole('button', { name: 'Pan the view (6)' }).count()).toBe(1);
    if (!canEdit) {
      await page.getByText('Read-only').waitFor();
      expect(await page.getByRole('button', { name: 'Restore' }).count()).toBe(0);
    }
  });
});

describe('outsider', () => {
  it('sees only their own series, and Kettle Crab is not there for them', async () => {
    await signIn(page, baseUrl, 'outsider@quadrille.test');
    await page.getByRole('link', { name: /Lantern Moth/ }).waitFor();
    expect(await page.getByRole('link', { name: /Kettle Crab/ }).count()).toBe(0);
    const res = await page.goto(KETTLE);
    expect(res?.status()).toBe(404);
    await page.getByRole('heading', { name: 'Nothing here' }).waitFor();
    const gag = await page.goto(GAG);
    expect(gag?.status()).toBe(404);
  });
});

describe('anonymous', () => {
  it('is sent to sign in, and comes back after', async () => {
    await page.context().clearCookies();
    await page.goto(GAG);
    await page.waitForURL(/\/signin\?callbackUrl=/);
    await page.getByLabel('E-mail').fill('editor@quadrille.test');
    await page.getByLabel('Password').fill('kettle-crab-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(GAG);
    await page.getByRole('heading', { name: 'Sugar Cube' }).waitFor();
  });
});
