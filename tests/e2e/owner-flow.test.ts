// The owner works the board: creates a gag, writes its beats (autosaved), renames
// it, moves its status, finds it in the table view, and deletes it with a confirmation.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
let gagUrl = '';

beforeAll(async () => {
  await signIn(page, baseUrl, 'owner@quadrille.test');
});

async function waitSaved() {
  await page.locator('[data-save-state="saved"]').waitFor();
}

describe('owner on the board', () => {
  it('refuses a gag without a title, then creates one', async () => {
    await page.goto(`${baseUrl}/series/demo-kettle-crab`);
    await page.getByRole('button', { name: 'Add gag' }).click();
    await page.getByText('Give the gag a title.').waitFor();
    await page.getByLabel('Title', { exact: true }).fill('Periwinkle Parade');
    await page.getByLabel('Premise (one line)').fill('Periwinkles march past the teapot; Kettle joins in.');
    await page.getByRole('button', { name: 'Add gag' }).click();
    const ideaColumn = page.getByRole('region', { name: /^Idea/ });
    await ideaColumn.getByRole('link', { name: 'Periwinkle Parade' }).waitFor();
  });

  it('writes a beat note that survives a reload', async () => {
    // Exact: the activity feed, now live, links "added the gag “Periwinkle Parade”" too.
    await page.getByRole('link', { name: 'Periwinkle Parade', exact: true }).click();
    await page.waitForURL(/\/gags\//);
    gagUrl = page.url();
    const setup = page.getByLabel('Setup', { exact: true });
    await setup.fill('A line of periwinkles crosses the pier boards.');
    await page.getByLabel('Turn', { exact: true }).fill('Kettle falls in step, teapot and all.');
    await waitSaved();
    await page.reload();
    expect(await page.getByLabel('Setup', { exact: true }).inputValue()).toBe('A line of periwinkles crosses the pier boards.');
    expect(await page.getByLabel('Turn', { exact: true }).inputValue()).toBe('Kettle falls in step, teapot and all.');
  });

  it('renames the gag and moves it to thumbnailing; both stick', async () => {
    const title = page.getByLabel('Title', { exact: true });
    await title.fill('Periwinkle March');
    await waitSaved();
    await page.getByLabel('Status', { exact: true }).selectOption('thumbnailing');
    await page.locator('text=Thumbnailing').first().waitFor();
    await page.reload();
    expect(await page.getByLabel('Title', { exact: true }).inputValue()).toBe('Periwinkle March');
    expect(await page.getByLabel('Status', { exact: true }).inputValue()).toBe('thumbnailing');
    // "Ready to ink" is not on offer: only a stamp sets it.
    const options = await page.getByLabel('Status', { exact: true }).locator('option').allTextContents();
    expect(options.join('|')).not.toMatch(/Ready to ink/);
  });

  it('finds it in the table view by search, with 2 of 4 beats written', async () => {
    await page.goto(`${baseUrl}/series/demo-kettle-crab`);
    await page.getByRole('button', { name: 'Table' }).click();
    await page.getByLabel('Search title and premise').fill('periwinkles teapot');
    const rows = page.locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().textContent()).toContain('Periwinkle March');
    expect(await rows.first().textContent()).toContain('2/4');
    await page.getByLabel('Search title and premise').fill('');
    await page.getByLabel('Status', { exact: true }).selectOption('placed');
    await expect.poll(() => rows.count()).toBe(2);
    // Sorting by title, ascending then descending.
    await page.getByLabel('Status', { exact: true }).selectOption('all');
    await page.getByRole('button', { name: /^Title/ }).click();
    const first = await rows.first().locator('td').first().locator('a').textContent();
    await page.getByRole('button', { name: /^Title/ }).click();
    const firstDesc = await rows.first().locator('td').first().locator('a').textContent();
    expect(first).not.toBe(firstDesc);
    expect([first, firstDesc].sort()).toEqual([first, firstDesc]);
  });

  it('deletes it after confirming', async () => {
    await page.goto(gagUrl);
    await page.getByRole('button', { name: 'Delete gag' }).click();
    const dialog = page.getByRole('dialog', { name: 'Delete this gag?' });
    await dialog.waitFor();
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    expect(await page.getByRole('dialog').count()).toBe(0);
    await page.getByRole('button', { name: 'Delete gag' }).click();
    await dialog.getByRole('button', { name: 'Delete gag' }).click();
    await page.waitForURL(`${baseUrl}/series/demo-kettle-crab`);
    await page.getByRole('link', { name: 'Sugar Cube', exact: true }).waitFor();
    expect(await page.getByRole('link', { name: 'Periwinkle March', exact: true }).count()).toBe(0);
    expect((await page.goto(gagUrl))?.status()).toBe(404);
  });
});
