// The pages' Content-Security-Policy in a real browser: every page answers
// with a fresh nonce, the app's own scripts (which carry it) run and raise no
// policy violation, and script in markup slipped into the page does not run.
// Directives as in W3C Content Security Policy Level 3 (nonce-source, 'strict-dynamic').
import { describe, expect, inject, it } from 'vitest';
import { signIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();

describe('content security policy', () => {
  it('each page load gets its own nonce; the app runs under it without a violation; injected markup runs no script', async () => {
    const violations: string[] = [];
    page.on('console', (m) => {
      if (/Content Security Policy/i.test(m.text())) violations.push(m.text());
    });
    const first = await page.goto(`${baseUrl}/signin`);
    const second = await page.goto(`${baseUrl}/signin`);
    const nonceOf = (policy: string | undefined) => /'nonce-([A-Za-z0-9+/=]+)'/.exec(policy ?? '')?.[1];
    const a = nonceOf(first?.headers()['content-security-policy']);
    const b = nonceOf(second?.headers()['content-security-policy']);
    expect(a).toMatch(/^[A-Za-z0-9+/]{22}==$/); // 16 random bytes
    expect(b).toBeDefined();
    expect(b).not.toBe(a);
    expect(second?.headers()['content-security-policy']).toContain("frame-ancestors 'none'");
    // Next.js put the nonce on its own scripts.
    const scripts = await page.locator('script').evaluateAll((els) => els.map((e) => (e as HTMLScriptElement).nonce));
    expect(scripts.length).toBeGreaterThan(0);
    expect(scripts.every((n) => n === b)).toBe(true);

    // Signing in, the board and a gag page (client code, live stream, thumbnails) run under the policy.
    await signIn(page, baseUrl, 'owner@quadrille.test');
    await page.goto(`${baseUrl}/series/demo-kettle-crab/gags/demo-gag-08`);
    await page.getByRole('heading', { name: 'Fog Horn' }).waitFor();

    // Markup slipped into the page (what an injection would look like) cannot run script:
    // its inline handler is refused and the browser reports the violation.
    const stray = await page.evaluate(
      () =>
        new Promise<{ ran: boolean; violated: string[] }>((resolve) => {
          const violated: string[] = [];
          document.addEventListener('securitypolicyviolation', (e) => violated.push(e.effectiveDirective));
          document.body.insertAdjacentHTML('beforeend', '<img alt="" src="data:," onerror="window.__strayHandlerRan = true">');
          setTimeout(() => resolve({ ran: (window as { __strayHandlerRan?: boolean }).__strayHandlerRan === true, violated }), 300);
        }),
    );
    expect(stray).toEqual({ ran: false, violated: ['script-src-attr'] });
    // The app itself raised no violation on any page visited; the one reported is the stray handler's.
    expect(violations).toHaveLength(1);
    expect(violations[0]).toMatch(/inline event handler/);
  });

  it('the API answers data under a policy that runs nothing', async () => {
    const res = await page.request.get(`${baseUrl}/api/health`);
    expect(res.headers()['content-security-policy']).toContain("default-src 'none'");
    expect(res.headers()['x-content-type-options']).toBe('nosniff');
  });
});
