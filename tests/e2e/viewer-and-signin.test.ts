// The viewer sees no editing controls and the API refuses their write;
// sign-in failures get a clear message, and 429 after 10 in 15 minutes.
import { describe, expect, inject, it } from 'vitest';
import { signIn, submitSignIn } from './browser';
import { usePage } from './page-fixture';

const baseUrl = inject('baseUrl');
const page = usePage();

describe('viewer', () => {
  it('has no editing controls, and the API refuses a write with 403', async () => {
    await signIn(page, baseUrl, 'viewer@quadrille.test');
    await page.goto(`${baseUrl}/series/demo-kettle-crab/gags/demo-gag-08`);
    await page.getByRole('heading', { name: 'Fog Horn' }).waitFor();
    // Nothing that changes the gag: no title or beat fields, no status, no comment box, no stamp,
    // and the checklist can be read but not ticked.
    expect(await page.locator('textarea').count()).toBe(0);
    expect(await page.locator('#gag-title, #gag-premise, #gag-status').count()).toBe(0);
    expect(await page.getByRole('button', { name: /Delete|Post comment|Stamp|New pass|Resolve/ }).count()).toBe(0);
    const ticks = page.getByRole('region', { name: 'Silent-read checklist' }).locator('input[type=checkbox]');
    await ticks.first().waitFor();
    expect(await ticks.evaluateAll((els) => els.every((e) => (e as HTMLInputElement).disabled))).toBe(true);

    // The same request the owner's page would send, from the viewer's signed-in page.
    const result = await page.evaluate(async () => {
      const res = await fetch('/api/gags/demo-gag-08', {
        method: 'PATCH',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ beats: [{ kind: 'setup', note: 'Vandalised' }] }),
      });
      return { status: res.status, body: await res.json() };
    });
    expect(result.status).toBe(403);
    expect(result.body.error).toMatch(/viewer/);
    await page.reload();
    expect(await page.content()).toContain('Pier lost in fog; only the teapot outline.');
    expect(await page.content()).not.toContain('Vandalised');
  });
});

describe('sign-in', () => {
  it('a wrong password shows a clear message on our sign-in page', async () => {
    await submitSignIn(page, baseUrl, 'cocreator@quadrille.test', 'not-the-password');
    // Our message, in an alert (Next's own route announcer is an alert too, so match by text).
    const alert = page.getByRole('alert').filter({ hasText: 'do not match an account' });
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/e-mail address and password do not match an account/);
    expect(page.url()).toContain('/signin');
  });

  it('a script signs in with a cookie jar through next-auth endpoints', async () => {
    const jar = new Map<string, string>();
    const cookieHeader = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
    const keep = (res: Response) => {
      for (const c of res.headers.getSetCookie()) {
        const [pair] = c.split(';');
        const i = pair!.indexOf('=');
        jar.set(pair!.slice(0, i), pair!.slice(i + 1));
      }
    };
    const csrfRes = await fetch(`${baseUrl}/api/auth/csrf`);
    keep(csrfRes);
    const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
    const login = await fetch(`${baseUrl}/api/auth/callback/credentials`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: cookieHeader() },
      body: new URLSearchParams({ csrfToken, email: 'editor@quadrille.test', password: 'kettle-crab-demo', json: 'true' }),
      redirect: 'manual',
    });
    keep(login);
    expect(login.status).toBe(200);
    const series = await fetch(`${baseUrl}/api/series`, { headers: { cookie: cookieHeader() } });
    expect(series.status).toBe(200);
    expect(await series.json()).toEqual([{ id: 'demo-kettle-crab', title: 'Kettle Crab', role: 'editor' }]);
    const write = await fetch(`${baseUrl}/api/series/demo-kettle-crab/gags`, {
      method: 'POST',
      headers: { cookie: cookieHeader(), 'content-type': 'application/json' },
      body: JSON.stringify({ title: 'Editor should not' }),
    });
    expect(write.status).toBe(403);
  });

  it('refuses with 429 after 10 failed sign-ins for one address in 15 minutes', async () => {
    const csrfRes = await fetch(`${baseUrl}/api/auth/csrf`);
    const cookie = csrfRes.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
    const attempt = (password: string) =>
      fetch(`${baseUrl}/api/auth/callback/credentials`, {
        method: 'POST',
        headers: { 'content-type': 'application/x-www-form-urlencoded', cookie },
        body: new URLSearchParams({ csrfToken, email: 'nobody@quadrille.test', password, json: 'true' }),
        redirect: 'manual',
      });
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await attempt(`guess-${i}`)).status);
    expect(statuses.every((s) => s === 401)).toBe(true);
    const locked = await attempt('guess-10');
    expect(locked.status).toBe(429);
    expect(locked.headers.get('retry-after')).toBe('900');

    // The sign-in page says so in words.
    await submitSignIn(page, baseUrl, 'nobody@quadrille.test', 'one more guess');
    const alert = page.getByRole('alert').filter({ hasText: 'Too many failed sign-ins' });
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/Wait 15 minutes/);
  });
});

describe('response headers', () => {
  it('pages and API answers forbid framing and type sniffing and keep URLs to this site', async () => {
    for (const path of ['/', '/signin', '/api/health']) {
      const res = await fetch(`${baseUrl}${path}`);
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
      expect(res.headers.get('x-frame-options'), path).toBe('DENY');
      expect(res.headers.get('content-security-policy'), path).toContain("frame-ancestors 'none'");
      expect(res.headers.get('referrer-policy'), path).toBe('same-origin');
    }
  });
});
