// Debian's Chromium driven by playwright-core (never a downloaded browser).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { type BrowserContext, type Page, chromium } from 'playwright-core';

export const DEMO_PASSWORD = 'kettle-crab-demo';

export async function openBrowser(
  opts: { viewport?: { width: number; height: number }; hasTouch?: boolean } = {},
): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-chromium-'));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
    headless: true,
    viewport: opts.viewport ?? { width: 1280, height: 900 },
    hasTouch: opts.hasTouch ?? false,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  context.setDefaultTimeout(20_000);
  return {
    context,
    close: async () => {
      await context.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Fills and sends our own sign-in form, signed out first; the caller checks what follows. */
export async function submitSignIn(page: Page, baseUrl: string, email: string, password: string) {
  await page.context().clearCookies();
  await page.goto(`${baseUrl}/signin`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in through our own sign-in page, as a person would. */
export async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD) {
  await submitSignIn(page, baseUrl, email, password);
  await page.waitForURL(`${baseUrl}/series`);
  await page.getByRole('heading', { name: 'My series' }).waitFor();
}
