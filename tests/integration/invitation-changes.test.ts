// What an owner does with an invitation after sending it — withdraw it, send it again — and signing
// up from one: the account takes the invited address. The last owner cannot be removed (409).
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import * as acceptRoute from '@/app/api/invitations/[token]/accept/route';
import * as invitationRoute from '@/app/api/series/[seriesId]/invitations/[invitationId]/route';
import * as resendRoute from '@/app/api/series/[seriesId]/invitations/[invitationId]/resend/route';
import * as invitationsRoute from '@/app/api/series/[seriesId]/invitations/route';
import * as memberRoute from '@/app/api/series/[seriesId]/members/[userId]/route';
import * as usersRoute from '@/app/api/users/route';
import * as seriesRoute from '@/app/api/series/route';
import { acceptInvitation, createInvitation } from '@/db/queries/members';
import { callRoute } from '../support/call-route';
import { startMailFake } from '../support/mail-fake';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
let mail: Awaited<ReturnType<typeof startMailFake>>;
/** A series of the demo owner's that none of the other personas belongs to, so each may accept once. */
let SERIES = '';
beforeAll(async () => {
  mail = await startMailFake();
  db = await freshDb();
  SERIES = (await callRoute(seriesRoute.POST, { method: 'POST', as: 'owner', body: { title: 'Tide Tables' } })).body.id;
});
afterAll(async () => {
  await mail?.stop();
});
afterEach(() => {
  vi.useRealTimers();
});

const invite = async (email: string, anyoneWithLink = false) =>
  (
    await callRoute(invitationsRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { seriesId: SERIES },
      body: { email, role: 'editor', anyoneWithLink },
    })
  ).body as { id: string };
/** The tokens of the invitation links mailed to an address, newest first. */
async function tokensFor(to: string, count: number): Promise<string[]> {
  let tokens: string[] = [];
  await expect
    .poll(async () => {
      tokens = (await mail.read())
        .filter((m) => m.to === to)
        .map((m) => m.text.match(/\/invite\/([A-Za-z0-9_-]+)/)?.[1] ?? '')
        .filter(Boolean);
      return tokens.length;
    })
    .toBe(count);
  return tokens;
}
const accept = (token: string, as: 'viewer' | 'outsider' = 'viewer') => callRoute(acceptRoute.POST, { method: 'POST', as, params: { token } });
const revoke = (invitationId: string, seriesId = SERIES, as: 'owner' | 'outsider' | 'editor' = 'owner') =>
  callRoute(invitationRoute.DELETE, { method: 'DELETE', as, params: { seriesId, invitationId } });
const resend = (invitationId: string, seriesId = SERIES) =>
  callRoute(resendRoute.POST, { method: 'POST', as: 'owner', params: { seriesId, invitationId } });
const pending = async () =>
  (await callRoute(invitationsRoute.GET, { as: 'owner', params: { seriesId: SERIES } })).body as {
    id: string;
    email: string;
    expired: boolean;
  }[];

describe('withdrawing an invitation', () => {
  it('answers 204; the link then answers 410 and the invitation leaves the list', async () => {
    const inv = await invite('drift@pier.test', true);
    const [token] = await tokensFor('drift@pier.test', 1);
    expect((await revoke(inv.id)).status).toBe(204);
    const r = await accept(token!);
    expect(r.status).toBe(410);
    expect(r.body.error).toBe('This invitation was withdrawn by the series’ owner.');
    expect((await pending()).map((i) => i.id)).not.toContain(inv.id);
    // Withdrawing it again changes nothing.
    expect((await revoke(inv.id)).status).toBe(204);
  });

  it('is refused for an invitation already accepted (409), another series’ (404), or not an owner (403)', async () => {
    const inv = await invite('buoy@pier.test', true);
    const [token] = await tokensFor('buoy@pier.test', 1);
    expect((await accept(token!)).status).toBe(200);
    const used = await revoke(inv.id);
    expect(used.status).toBe(409);
    expect(used.body.error).toMatch(/already accepted/);
    const other = await invite('gull@pier.test');
    expect((await revoke(other.id, OTHER_SERIES_ID, 'outsider')).status).toBe(404);
    // Named through a series it does not belong to, even one the caller owns: 404.
    expect((await revoke(other.id, DEMO_SERIES_ID, 'owner')).status).toBe(404);
    const demo = await createInvitation(db, { seriesId: DEMO_SERIES_ID, email: 'tern@pier.test', role: 'viewer', invitedBy: 'demo-user-owner' });
    expect((await revoke(demo.id, DEMO_SERIES_ID, 'editor')).status).toBe(403);
    expect((await revoke('no-such-invitation')).status).toBe(404);
    expect((await pending()).map((i) => i.id)).toContain(other.id);
  });
});

describe('sending an invitation again', () => {
  it('mails a fresh link; the old one answers 410 saying so; the new one works', async () => {
    const inv = await invite('kelp@pier.test', true);
    const r = await resend(inv.id);
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ email: 'kelp@pier.test', role: 'editor', anyoneWithLink: true, mailed: true });
    expect(r.body.id).not.toBe(inv.id);
    const [fresh, old] = await tokensFor('kelp@pier.test', 2);
    expect(fresh).not.toBe(old);
    const stale = await accept(old!);
    expect(stale.status).toBe(410);
    expect(stale.body.error).toMatch(/sent again with a new link/);
    expect((await pending()).filter((i) => i.email === 'kelp@pier.test').map((i) => i.id)).toEqual([r.body.id]);
    // The withdrawn one cannot be sent again; the new one can be withdrawn.
    expect((await resend(inv.id)).status).toBe(409);
    expect((await accept(fresh!, 'outsider')).status).toBe(200);
    expect((await resend(r.body.id)).status).toBe(409);
  });

  it('an expired invitation stays listed, marked expired, and can be sent again for 7 more days', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2027-01-10T12:00:00Z'));
    const inv = await invite('fog@pier.test');
    vi.setSystemTime(new Date('2027-01-20T12:00:00Z'));
    expect((await pending()).find((i) => i.id === inv.id)).toMatchObject({ expired: true });
    const r = await resend(inv.id);
    expect(r.status).toBe(201);
    expect(r.body.expiresAt).toBe('2027-01-27T12:00:00.000Z');
    expect((await pending()).find((i) => i.id === r.body.id)).toMatchObject({ expired: false });
  });
});

describe('signing up from an invitation', () => {
  const signUp = (body: Record<string, unknown>) => callRoute(usersRoute.POST, { method: 'POST', body });

  it('takes the invited address, and that account may accept the invitation', async () => {
    await invite('Pearl.Diver@Pier.test');
    const [token] = await tokensFor('pearl.diver@pier.test', 1);
    const r = await signUp({ name: 'Pearl Diver', invitation: token, password: 'long kettle lid' });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ email: 'pearl.diver@pier.test', name: 'Pearl Diver' });
    expect(await acceptInvitation(db, token!, r.body.id)).toEqual({ seriesId: SERIES, role: 'editor' });
    // The same invitation again: used, so it names no address any more.
    expect((await signUp({ name: 'Someone', invitation: token, password: 'long kettle lid' })).status).toBe(422);
  });

  it('refuses an open link, a withdrawn one, an unknown one, and both an address and an invitation (422); creates nothing', async () => {
    const users = async () => (await db.selectFrom('users').select('id').execute()).length;
    const before = await users();
    await invite('open@pier.test', true);
    const [open] = await tokensFor('open@pier.test', 1);
    const gone = await createInvitation(db, { seriesId: SERIES, email: 'gone@pier.test', role: 'viewer', invitedBy: 'demo-user-owner' });
    expect((await revoke(gone.id)).status).toBe(204);
    for (const invitation of [open, gone.token, 'no-such-token']) {
      const r = await signUp({ name: 'Tide', invitation, password: 'long kettle lid' });
      expect(r.status).toBe(422);
      expect(r.body.error).toMatch(/enter your e-mail address/);
    }
    expect((await signUp({ name: 'Tide', email: 'tide@pier.test', invitation: gone.token, password: 'long kettle lid' })).status).toBe(422);
    expect((await signUp({ name: 'Tide', password: 'long kettle lid' })).status).toBe(422);
    expect(await users()).toBe(before);
  });
});

describe('the last owner', () => {
  it('cannot remove themselves: 409 with the reason, and nothing changes', async () => {
    const r = await callRoute(memberRoute.DELETE, { method: 'DELETE', as: 'owner', params: { seriesId: DEMO_SERIES_ID, userId: 'demo-user-owner' } });
    expect(r.status).toBe(409);
    expect(r.body.error).toBe('The last owner cannot be removed: make another member owner first, so someone can still manage the series.');
    const still = await db
      .selectFrom('memberships')
      .select('role')
      .where('seriesId', '=', DEMO_SERIES_ID)
      .where('userId', '=', 'demo-user-owner')
      .executeTakeFirst();
    expect(still).toEqual({ role: 'owner' });
  });
});
