// The page a browser test file works with (vitest hooks open and close it).
import type { Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { openBrowser } from './browser';

/**
 * One Chromium and one page for a test file: opened before its tests, closed
 * after. Returns the page (a stand-in that forwards to the real one once open).
 */
export function usePage(): Page {
  let browser: Awaited<ReturnType<typeof openBrowser>> | undefined;
  let real: Page | undefined;
  beforeAll(async () => {
    browser = await openBrowser();
    real = await browser.context.newPage();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return new Proxy({} as Page, {
    get(_target, prop) {
      if (!real) throw new Error('The page is opened in beforeAll; use it inside tests and hooks.');
      const value = Reflect.get(real, prop, real);
      return typeof value === 'function' ? value.bind(real) : value;
    },
  });
}
