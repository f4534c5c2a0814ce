import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import * as acceptRoute from '@/app/api/invitations/[token]/accept/route';
import * as meRoute from '@/app/api/me/route';
import * as invitationsRoute from '@/app/api/series/[seriesId]/invitations/route';
import * as memberRoute from '@/app/api/series/[seriesId]/members/[userId]/route';
import * as membersRoute from '@/app/api/series/[seriesId]/members/route';
import * as seriesRoute from '@/app/api/series/route';
import { callRoute } from '../support/call-route';
import { startMailFake } from '../support/mail-fake';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, freshDb } from '../support/test-db';

let mail: Awaited<ReturnType<typeof startMailFake>>;
beforeAll(async () => {
  mail = await startMailFake();
  await freshDb();
});
afterAll(async () => {
  await mail?.stop();
});
afterEach(() => {
  vi.useRealTimers();
});

const invite = (email: string, role = 'editor') =>
  callRoute(invitationsRoute.POST, { method: 'POST', as: 'owner', params: { seriesId: DEMO_SERIES_ID }, body: { email, role } });

async function tokenFromMail(to: string): Promise<string> {
  let link = '';
  await expect
    .poll(async () => {
      const m = (await mail.read()).find((x) => x.to === to);
      link = m?.text.match(/https?:\/\/\S+\/invite\/([A-Za-z0-9_-]+)/)?.[0] ?? '';
      return link;
    })
    .not.toBe('');
  return link.split('/invite/')[1]!;
}

describe('invitations', () => {
  it('the e-mail arrives at the SMTP fake with a working one-time link', async () => {
    const r = await invite('outsider@quadrille.test', 'editor');
    expect(r.status).toBe(201);
    expect(r.body.mailed).toBe(true);
    const m = (await mail.read()).find((x) => x.to === 'outsider@quadrille.test')!;
    expect(m.subject).toBe('Nell Harrow invites you to “Kettle Crab” on Quadrille');
    expect(m.html).toContain('Accept the invitation');
    const token = await tokenFromMail('outsider@quadrille.test');
    const ok = await callRoute(acceptRoute.POST, { method: 'POST', as: 'outsider', params: { token } });
    expect(ok).toEqual({ status: 200, body: { seriesId: DEMO_SERIES_ID, role: 'editor' } });
    const mine = await callRoute(seriesRoute.GET, { as: 'outsider' });
    expect(mine.body.map((s: { id: string }) => s.id).sort()).toEqual([DEMO_SERIES_ID, OTHER_SERIES_ID].sort());
    // It works once.
    const again = await callRoute(acceptRoute.POST, { method: 'POST', as: 'viewer', params: { token } });
    expect(again.status).toBe(410);
  });

  it('expires after 7 days (clock moved forward)', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2027-01-10T12:00:00Z'));
    await invite('late@pier.test', 'viewer');
    const token = await tokenFromMail('late@pier.test');
    vi.setSystemTime(new Date('2027-01-17T12:00:01Z'));
    const r = await callRoute(acceptRoute.POST, { method: 'POST', as: 'viewer', params: { token } });
    expect(r.status).toBe(410);
    expect(r.body.error).toMatch(/expired/);
  });

  it('a day before expiry it still works', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2027-02-01T09:00:00Z'));
    const { body } = await callRoute(seriesRoute.POST, { method: 'POST', as: 'owner', body: { title: 'Tide Tables' } });
    const r = await callRoute(invitationsRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { seriesId: body.id },
      body: { email: 'viewer@quadrille.test', role: 'cocreator' },
    });
    expect(r.status).toBe(201);
    const token = await tokenFromMail('viewer@quadrille.test');
    vi.setSystemTime(new Date('2027-02-07T09:00:00Z'));
    expect((await callRoute(acceptRoute.POST, { method: 'POST', as: 'viewer', params: { token } })).status).toBe(200);
  });

  it('an unknown token is 404; inviting a member is 409; a bad role is 422', async () => {
    expect((await callRoute(acceptRoute.POST, { method: 'POST', as: 'viewer', params: { token: 'nope' } })).status).toBe(404);
    expect((await invite('cocreator@quadrille.test')).status).toBe(409);
    expect((await invite('new@pier.test', 'boss')).status).toBe(422);
  });
});

describe('members', () => {
  it('the owner changes roles and removes members, never the last owner', async () => {
    const list = await callRoute(membersRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } });
    expect(list.body.map((m: { role: string }) => m.role)).toContain('owner');
    const up = await callRoute(memberRoute.PATCH, {
      method: 'PATCH',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID, userId: 'demo-user-viewer' },
      body: { role: 'editor' },
    });
    expect(up.body).toMatchObject({ userId: 'demo-user-viewer', role: 'editor' });
    const lastOwner = await callRoute(memberRoute.PATCH, {
      method: 'PATCH',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID, userId: 'demo-user-owner' },
      body: { role: 'viewer' },
    });
    expect(lastOwner.status).toBe(409);
    expect(
      (await callRoute(memberRoute.DELETE, { method: 'DELETE', as: 'owner', params: { seriesId: DEMO_SERIES_ID, userId: 'demo-user-owner' } }))
        .status,
    ).toBe(409);
    expect(
      (await callRoute(memberRoute.DELETE, { method: 'DELETE', as: 'owner', params: { seriesId: DEMO_SERIES_ID, userId: 'demo-user-outsider' } }))
        .status,
    ).toBe(204);
    expect((await callRoute(membersRoute.GET, { as: 'outsider', params: { seriesId: DEMO_SERIES_ID } })).status).toBe(404);
  });
});

describe('my notifications', () => {
  it('can be turned off and on', async () => {
    expect((await callRoute(meRoute.PATCH, { method: 'PATCH', as: 'editor', body: { notifyEmail: false } })).status).toBe(200);
    expect((await callRoute(meRoute.GET, { as: 'editor' })).body.notifyEmail).toBe(false);
    expect((await callRoute(meRoute.PATCH, { method: 'PATCH', as: 'editor', body: { notifyEmail: 'no' } })).status).toBe(422);
  });
});
