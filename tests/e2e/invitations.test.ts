// Issue 15, found 7, in Chromium: the owner invites two addresses, withdraws one (its link then says
// so), sends the other again (its first link then says so); the invited person creates an account from
// the newest link — the form has the invited address already — and joins. "Remove" on the last owner
// is disabled with the reason. Addresses of its own (shore crab, driftwood); no demo gag.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage(); // the owner
const MEMBERS = `${baseUrl}/series/demo-kettle-crab/members`;

let stranger: Awaited<ReturnType<typeof openBrowser>>;
let newcomer: Page;
beforeAll(async () => {
  stranger = await openBrowser();
  newcomer = await stranger.context.newPage();
  await signIn(page, baseUrl, 'owner@quadrille.test');
});
afterAll(async () => {
  await stranger?.close();
});

/** The invitation links mailed to an address, newest first, from the local mailbox. */
async function linksTo(address: string): Promise<string[]> {
  const box = await stranger.context.newPage();
  await box.goto(`${baseUrl}/dev/mail`);
  const texts = await box
    .getByTestId('caught-mail')
    .filter({ hasText: `To ${address}` })
    .allTextContents();
  await box.close();
  return texts.map((t) => /https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/.exec(t)?.[0] ?? '').filter(Boolean);
}

async function invite(address: string) {
  await page.getByLabel('E-mail', { exact: true }).fill(address);
  await page.getByLabel('Role', { exact: true }).selectOption('cocreator');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await page
    .getByRole('status')
    .filter({ hasText: `Invitation sent to ${address}.` })
    .waitFor();
}

describe('invitations after sending', () => {
  it('the owner withdraws one: it leaves the list and its link says it was withdrawn', async () => {
    await page.goto(MEMBERS);
    await invite('driftwood@pier.test');
    const list = page.getByTestId('invitations');
    await list.getByText('driftwood@pier.test').waitFor();
    await page.getByRole('button', { name: 'Withdraw the invitation to driftwood@pier.test' }).click();
    const ask = page.getByRole('dialog');
    await ask.getByRole('button', { name: 'Withdraw' }).click();
    await page.getByRole('status').filter({ hasText: 'The invitation to driftwood@pier.test was withdrawn.' }).waitFor();
    await expect.poll(() => list.getByText('driftwood@pier.test').count()).toBe(0);

    await expect.poll(async () => (await linksTo('driftwood@pier.test')).length).toBe(1);
    const [link] = await linksTo('driftwood@pier.test');
    await newcomer.goto(link!);
    await newcomer.getByText('This invitation was withdrawn by the series’ owner.').waitFor();
    expect(await newcomer.getByRole('link', { name: 'Create an account' }).count()).toBe(0);
    // The link itself answers 410 when someone tries to accept it.
    const token = link!.split('/invite/')[1];
    await signIn(newcomer, baseUrl, 'outsider@quadrille.test');
    const r = await newcomer.request.post(`${baseUrl}/api/invitations/${token}/accept`);
    expect(r.status()).toBe(410);
    await newcomer.context().clearCookies();
  });

  it('the owner sends one again: a new e-mail; the first link says to use the newer one', async () => {
    await invite('shore.crab@pier.test');
    await page.getByRole('button', { name: 'Send the invitation to shore.crab@pier.test again' }).click();
    await page.getByRole('status').filter({ hasText: 'Sent again to shore.crab@pier.test' }).waitFor();
    await expect.poll(async () => (await linksTo('shore.crab@pier.test')).length).toBe(2);
    const [, first] = await linksTo('shore.crab@pier.test');
    await newcomer.goto(first!);
    await newcomer.getByText('This invitation was sent again with a new link: use the one in the latest e-mail.').waitFor();
  });

  it('signing up from the newest link fills in the invited address, and the new account joins', async () => {
    const [newest] = await linksTo('shore.crab@pier.test');
    await newcomer.goto(newest!);
    await newcomer.getByRole('heading', { name: 'Join “Kettle Crab”' }).waitFor();
    await newcomer.getByRole('link', { name: 'Create an account' }).click();
    await newcomer.waitForURL(/\/signup\?callbackUrl=/);
    // Shown as the invitation page shows it, partly masked; the account takes the address itself.
    expect(await newcomer.getByTestId('invited-address').textContent()).toContain('sh•••@p•••.test');
    expect(await newcomer.getByLabel('E-mail', { exact: true }).count()).toBe(0);
    await newcomer.getByLabel('Your name').fill('Shore Crab');
    await newcomer.getByLabel('Password').fill('barnacles on the teapot');
    await newcomer.getByRole('button', { name: 'Create account' }).click();
    await newcomer.waitForURL(newest!);
    await newcomer.getByRole('button', { name: 'Accept the invitation' }).click();
    await newcomer.waitForURL(`${baseUrl}/series/demo-kettle-crab`);
    const me = (await (await newcomer.request.get(`${baseUrl}/api/me`)).json()) as { email: string; name: string };
    expect(me).toMatchObject({ email: 'shore.crab@pier.test', name: 'Shore Crab' });
    await page.reload();
    await page.getByRole('cell', { name: 'shore.crab@pier.test' }).waitFor();
    expect(await page.getByTestId('invitations').getByText('shore.crab@pier.test').count()).toBe(0);
  });
});

describe('the last owner', () => {
  it('cannot press "Remove" on themselves, and the page says why', async () => {
    const me = page.getByRole('row').filter({ hasText: 'Nell Harrow (you)' });
    const remove = me.getByRole('button', { name: 'Remove me' });
    expect(await remove.isDisabled()).toBe(true);
    const why = await remove.getAttribute('aria-describedby');
    expect(await page.locator(`[id="${why}"]`).textContent()).toBe(
      'You are the last owner. The series keeps at least one owner: make another member owner first.',
    );
    // Nor can that owner pick a role other than owner for themselves.
    const roles = me.getByLabel('Role of Nell Harrow');
    expect(await roles.locator('option:disabled').allTextContents()).toEqual(['Co-creator', 'Editor', 'Viewer']);
  });
});
