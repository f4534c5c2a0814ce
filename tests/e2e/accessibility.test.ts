// Every page, for every role and for a visitor who is not signed in, checked by
// axe-core (the accessibility engine, run inside Chromium on the real page):
// no violation of "serious" or "critical" impact is allowed.
import fs from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();
const axeSource = fs.readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

const SERIES = '/series/demo-kettle-crab';
const GAG = `${SERIES}/gags/demo-gag-01`;
const MEMBER_PAGES = ['/series', SERIES, GAG, `${GAG}/compare`, `${GAG}/passes/1`, `${SERIES}/members`, `${SERIES}/volumes/demo-volume-low-tide`];
const PUBLIC_PAGES = ['/', '/signin', '/signup'];

type Violation = { id: string; impact: string | null; help: string; nodes: { target: string[] }[] };

async function seriousViolations(p: Page, path: string): Promise<string[]> {
  await p.goto(`${baseUrl}${path}`);
  await p.waitForLoadState('networkidle');
  // Client pages fill in after their first requests: let the main content settle.
  await p.locator('main').first().waitFor();
  await p.addScriptTag({ content: axeSource });
  const violations = await p.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: Violation[] }> } }).axe;
    return (await axe.run(document, { resultTypes: ['violations'] })).violations;
  });
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${path}: ${v.id} (${v.impact}) — ${v.help} — at ${v.nodes
          .map((n) => n.target.join(' '))
          .slice(0, 3)
          .join(', ')}`,
    );
}

describe('signed out', () => {
  it.each(PUBLIC_PAGES)('%s has no serious or critical violations', async (path) => {
    await page.context().clearCookies();
    expect(await seriousViolations(page, path)).toEqual([]);
  });
});

for (const role of ['owner', 'cocreator', 'editor', 'viewer'] as const) {
  describe(`as the ${role}`, () => {
    beforeAll(async () => {
      await signIn(page, baseUrl, `${role}@quadrille.test`);
    });
    it.each(MEMBER_PAGES)('%s has no serious or critical violations', async (path) => {
      expect(await seriousViolations(page, path)).toEqual([]);
    });
  });
}
