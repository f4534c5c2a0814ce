// Sign-up, sign-in, sessions and invitations as issue 13 asks: passwords by OWASP ASVS 4.0.3 V2.1, a per-client
// sign-in limit that holds in parallel, sessions that end on the server (sign-out, a password change, removal from
// the last series), invitations tied to their address, and clean text in the JSON routes.
import bcrypt from 'bcryptjs';
import { encode } from 'next-auth/jwt';
import { NextRequest } from 'next/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as nextAuthRoute from '@/app/api/auth/[...nextauth]/route';
import * as commentsRoute from '@/app/api/gags/[gagId]/comments/route';
import * as gagRoute from '@/app/api/gags/[gagId]/route';
import * as acceptRoute from '@/app/api/invitations/[token]/accept/route';
import * as meRoute from '@/app/api/me/route';
import * as invitationsRoute from '@/app/api/series/[seriesId]/invitations/route';
import * as memberRoute from '@/app/api/series/[seriesId]/members/[userId]/route';
import * as seriesRoute from '@/app/api/series/route';
import * as usersRoute from '@/app/api/users/route';
import { createInvitation } from '@/db/queries/members';
import { insertUser } from '@/db/queries/users';
import { callRoute, cookieFor } from '../support/call-route';
import { Browser, callWithCookie } from '../support/auth-flow';
import { startMailFake } from '../support/mail-fake';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, countRows, freshDb } from '../support/test-db';
import { authSecret } from '@/lib/auth/secret';
import { MAX_CLIENT_ATTEMPTS, MAX_FAILURES } from '@/lib/auth/throttle';

let db: Awaited<ReturnType<typeof freshDb>>;
let mail: Awaited<ReturnType<typeof startMailFake>>;
beforeAll(async () => {
  process.env.NEXTAUTH_URL = 'http://localhost:3000';
  mail = await startMailFake();
  db = await freshDb();
});
afterAll(async () => {
  await mail?.stop();
});

let ips = 0;
/** A browser on its own network, so one test's attempts never count against another's. */
const browser = () => new Browser(`198.51.100.${++ips}`);

const signUp = (password: string, email = `${crypto.randomUUID()}@pier.test`, name = 'Pier Keeper') =>
  callRoute(usersRoute.POST, { method: 'POST', body: { name, email, password } });

const hashOf = async (email: string) =>
  (await db.selectFrom('users').select('passwordHash').where('email', '=', email).executeTakeFirstOrThrow()).passwordHash;

describe('sign-up passwords (OWASP ASVS 4.0.3 V2.1)', () => {
  it('refuses with a clear 422: too short, only spaces, NUL, too long', async () => {
    const cases: [string, RegExp][] = [
      ['short-pw', /at least 12 characters/],
      ['kettle      crab', /at least 12 characters \(a run of spaces counts as one\)/], // 11 once the run is combined (2.1.1)
      [' '.repeat(12), /more than spaces/],
      ['\u0000'.repeat(12), /control character \(U\+0000\)/],
      ['x'.repeat(129), /at most 128 characters/], // 2.1.2
    ];
    const before = await countRows(db, ['users']);
    for (const [password, message] of cases) {
      const r = await signUp(password);
      expect(r.status, JSON.stringify(password)).toBe(422);
      expect(r.body.error).toMatch(message);
      expect(r.body.issues[0].path).toEqual(['password']);
    }
    expect(await countRows(db, ['users'])).toEqual(before);
  });

  it('refuses a common password from the shipped list, whatever its case (2.1.7)', async () => {
    // "leavemealone" and "administrator" are in @zxcvbn-ts/language-common's passwords-common list.
    for (const password of ['leavemealone', 'LeaveMeAlone', 'ADMINISTRATOR']) {
      const r = await signUp(password);
      expect(r.status).toBe(422);
      expect(r.body.error).toMatch(/list of common passwords/);
      expect(r.body.issues).toEqual([expect.objectContaining({ path: ['password'] })]);
    }
  });

  it('accepts the demo password and 128 characters, stores an scrypt hash and never the password', async () => {
    const r = await signUp('kettle-crab-demo', 'Demo.Like@Pier.test');
    expect(r.status).toBe(201);
    const h = await hashOf('demo.like@pier.test');
    expect(h).toMatch(/^scrypt\$32768\$8\$3\$/);
    expect(h).not.toContain('kettle-crab-demo');
    expect((await signUp('y'.repeat(128))).status).toBe(201);
  });

  it('a name with a control character is refused too', async () => {
    const r = await signUp('kettle-crab-demo', undefined, 'Nell\u0000Harrow');
    expect(r.status).toBe(422);
    expect(r.body.error).toMatch(/The name contains a control character/);
  });
});

describe('sign-in', () => {
  it('the demo accounts sign in; a bcrypt hash from before still works and becomes scrypt on sign-in', async () => {
    expect((await browser().signIn('viewer@quadrille.test', 'kettle-crab-demo')).ok).toBe(true);
    await insertUser(db, { id: 'old-timer', email: 'old@pier.test', name: 'Old Timer', passwordHash: await bcrypt.hash('an-old-password', 4) });
    expect((await browser().signIn('old@pier.test', 'an-old-pasword')).error).toBe('CredentialsSignin');
    expect(await hashOf('old@pier.test')).toMatch(/^\$2[ab]\$/); // a failed sign-in changes nothing
    const b = browser();
    expect(await b.signIn('old@pier.test', 'an-old-password')).toMatchObject({ ok: true });
    expect(await hashOf('old@pier.test')).toMatch(/^scrypt\$32768\$8\$3\$/);
    expect((await browser().signIn('old@pier.test', 'an-old-password')).ok).toBe(true);
  });
});

describe('sessions end on the server', () => {
  it('a cookie kept from before sign-out answers 401', async () => {
    const b = browser();
    expect((await b.signIn('editor@quadrille.test', 'kettle-crab-demo')).ok).toBe(true);
    const kept = b.sessionCookie();
    expect((await callWithCookie(meRoute.GET, kept)).status).toBe(200);
    await b.signOut();
    expect(b.sessionCookie()).toBeNull();
    const after = await callWithCookie(meRoute.GET, kept);
    expect(after.status).toBe(401);
    expect(after.body.error).toBe('Sign in first.');
    // Signing out ends that session only: another device stays signed in.
    const other = browser();
    await other.signIn('editor@quadrille.test', 'kettle-crab-demo');
    expect((await callWithCookie(meRoute.GET, other.sessionCookie())).status).toBe(200);
  });

  it('a cookie that names no session (made before sessions were recorded) answers 401', async () => {
    const legacy = await encode({ token: { sub: 'demo-user-owner', email: 'owner@quadrille.test', name: 'Nell Harrow' }, secret: authSecret()! });
    expect((await callWithCookie(meRoute.GET, `next-auth.session-token=${legacy}`)).status).toBe(401);
    // A session id that was never started is no better.
    const made = await cookieFor({ sub: 'demo-user-owner', email: 'owner@quadrille.test', name: 'Nell Harrow', sid: 'never-started' });
    expect((await callWithCookie(meRoute.GET, made)).status).toBe(401);
  });

  it('a password change needs the current password, and ends every other session', async () => {
    await insertUser(db, { id: 'changer', email: 'changer@pier.test', name: 'Changer', passwordHash: await bcrypt.hash('first-password-1', 4) });
    const here = browser();
    const elsewhere = browser();
    expect((await here.signIn('changer@pier.test', 'first-password-1')).ok).toBe(true);
    expect((await elsewhere.signIn('changer@pier.test', 'first-password-1')).ok).toBe(true);
    const patch = (body: unknown) => callWithCookie(meRoute.PATCH, here.sessionCookie(), { method: 'PATCH', body });

    const wrong = await patch({ currentPassword: 'not-the-password', newPassword: 'second-password-2' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.issues).toEqual([expect.objectContaining({ path: ['currentPassword'], message: 'That is not your current password.' })]);
    const common = await patch({ currentPassword: 'first-password-1', newPassword: 'qwerty123456' });
    expect(common.status).toBe(422);
    expect(common.body.issues[0].path).toEqual(['newPassword']);
    const short = await patch({ currentPassword: 'first-password-1', newPassword: 'short' });
    expect(short.status).toBe(422);
    expect(short.body.error).toMatch(/at least 12 characters/);
    const withoutCurrent = await patch({ newPassword: 'second-password-2' });
    expect(withoutCurrent.status).toBe(422);
    expect(withoutCurrent.body.error).toMatch(/current password/);
    // Nothing so far changed anything.
    expect((await callWithCookie(meRoute.GET, elsewhere.sessionCookie())).status).toBe(200);

    const ok = await patch({ currentPassword: 'first-password-1', newPassword: 'second-password-2' });
    expect(ok).toEqual({ status: 200, body: { id: 'changer', passwordChanged: true, otherSessionsEnded: 1 } });
    expect((await callWithCookie(meRoute.GET, here.sessionCookie())).status).toBe(200);
    expect((await callWithCookie(meRoute.GET, elsewhere.sessionCookie())).status).toBe(401);
    expect((await browser().signIn('changer@pier.test', 'first-password-1')).error).toBe('CredentialsSignin');
    expect((await browser().signIn('changer@pier.test', 'second-password-2')).ok).toBe(true);
  });

  it('guessing the current password through a session is held to the per-address limit', async () => {
    await insertUser(db, { id: 'guessed', email: 'guessed@pier.test', name: 'Guessed', passwordHash: await bcrypt.hash('the-real-password', 4) });
    const b = browser();
    await b.signIn('guessed@pier.test', 'the-real-password');
    const statuses = [];
    for (let i = 0; i < MAX_FAILURES + 1; i++) {
      const r = await callWithCookie(meRoute.PATCH, b.sessionCookie(), {
        method: 'PATCH',
        body: { currentPassword: `guess-${i}`, newPassword: 'a-brand-new-password' },
      });
      statuses.push(r.status);
    }
    expect(statuses.slice(0, MAX_FAILURES).every((s) => s === 422)).toBe(true);
    expect(statuses[MAX_FAILURES]).toBe(429);
  });

  it('removal from their last series ends a person’s sessions; removal from one of two does not', async () => {
    const now = new Date().toISOString();
    for (const id of ['leaver', 'stayer']) {
      await insertUser(db, { id, email: `${id}@pier.test`, name: id, passwordHash: await bcrypt.hash('members-password', 4) });
      await db.insertInto('memberships').values({ seriesId: DEMO_SERIES_ID, userId: id, role: 'viewer', createdAt: now }).execute();
    }
    await db.insertInto('memberships').values({ seriesId: OTHER_SERIES_ID, userId: 'stayer', role: 'viewer', createdAt: now }).execute();
    const leaver = browser();
    const stayer = browser();
    await leaver.signIn('leaver@pier.test', 'members-password');
    await stayer.signIn('stayer@pier.test', 'members-password');
    for (const userId of ['leaver', 'stayer']) {
      const r = await callRoute(memberRoute.DELETE, { method: 'DELETE', as: 'owner', params: { seriesId: DEMO_SERIES_ID, userId } });
      expect(r.status).toBe(204);
    }
    expect((await callWithCookie(meRoute.GET, leaver.sessionCookie())).status).toBe(401);
    expect((await callWithCookie(meRoute.GET, stayer.sessionCookie())).status).toBe(200);
  });
});

describe('the per-client sign-in limit', () => {
  it(`lets exactly ${MAX_CLIENT_ATTEMPTS} password checks through from one client, however many arrive at once`, { timeout: 120_000 }, async () => {
    const ip = '203.0.113.50';
    // 40 sign-ins at once for 8 addresses nobody has (5 each, under the per-address limit).
    const tries = await Promise.all(Array.from({ length: 40 }, (_, i) => new Browser(ip).signIn(`nobody-${i % 8}@pier.test`, 'some-password-guess')));
    const errors = tries.map((t) => t.error);
    // CredentialsSignin is only answered after a password check; TooManyFromClient before any.
    expect(errors.filter((e) => e === 'CredentialsSignin')).toHaveLength(MAX_CLIENT_ATTEMPTS);
    expect(errors.filter((e) => e === 'TooManyFromClient')).toHaveLength(40 - MAX_CLIENT_ATTEMPTS);
    const counted = await db.selectFrom('signInClientAttempts').select('id').where('client', '=', ip).execute();
    expect(counted).toHaveLength(MAX_CLIENT_ATTEMPTS);

    // Even the right password of a real account waits now, from this client; another client is not affected.
    expect((await new Browser(ip).signIn('owner@quadrille.test', 'kettle-crab-demo')).error).toBe('TooManyFromClient');
    expect((await new Browser('203.0.113.51').signIn('owner@quadrille.test', 'kettle-crab-demo')).ok).toBe(true);

    // The route answers 429 before next-auth runs at all.
    const body = new URLSearchParams({ email: 'owner@quadrille.test', password: 'kettle-crab-demo', csrfToken: 'x', json: 'true' }).toString();
    const req = new NextRequest('http://localhost:3000/api/auth/callback/credentials', {
      method: 'POST',
      body,
      headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-forwarded-for': ip },
    });
    const res = await nextAuthRoute.POST(req, { params: Promise.resolve({ nextauth: ['callback', 'credentials'] }) });
    expect(res.status).toBe(429);
    expect(res.headers.get('retry-after')).toBe('900');
    const answer = await res.json();
    expect(answer.error).toMatch(/from your network/);
    expect(new URL(answer.url).searchParams.get('error')).toBe('TooManyFromClient');
  });

  it('a successful sign-in gives its slot back: only failures use a client up', async () => {
    const ip = '203.0.113.60';
    for (let i = 0; i < 3; i++) expect((await new Browser(ip).signIn('cocreator@quadrille.test', 'kettle-crab-demo')).ok).toBe(true);
    expect(await db.selectFrom('signInClientAttempts').select('id').where('client', '=', ip).execute()).toHaveLength(0);
  });

  it('sign-ups count against the client too (each costs a hash)', async () => {
    const ip = '203.0.113.70';
    await db
      .insertInto('signInClientAttempts')
      .values(Array.from({ length: MAX_CLIENT_ATTEMPTS }, () => ({ client: ip, at: Date.now() })))
      .execute();
    const req = new Request('http://localhost/api/users', {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-forwarded-for': ip },
      body: JSON.stringify({ name: 'Flood', email: 'flood@pier.test', password: 'kettle-crab-demo' }),
    });
    const res = await usersRoute.POST(req);
    expect(res.status).toBe(429);
    expect(await db.selectFrom('users').select('id').where('email', '=', 'flood@pier.test').executeTakeFirst()).toBeUndefined();
  });
});

describe('invitations tied to their address', () => {
  const token = (email: string, anyoneWithLink = false) =>
    createInvitation(db, { seriesId: DEMO_SERIES_ID, email, role: 'viewer', invitedBy: 'demo-user-owner', anyoneWithLink }).then((i) => i.token);

  it('another account is refused 403, told the address partly masked; the addressee accepts, in any case of letters', async () => {
    await insertUser(db, { id: 'invitee', email: 'marguerite@harbour.example', name: 'Marguerite', passwordHash: 'x' });
    const t = await token('Marguerite@Harbour.example');
    const refused = await callRoute(acceptRoute.POST, { method: 'POST', as: 'outsider', params: { token: t } });
    expect(refused.status).toBe(403);
    expect(refused.body.error).toContain('ma•••@h•••.example');
    expect(refused.body.error).not.toContain('marguerite');
    expect(refused.body.error).toContain('outsider@quadrille.test');
    const invitee = browser();
    await db
      .updateTable('users')
      .set({ passwordHash: await bcrypt.hash('marguerite-pw-1', 4) })
      .where('id', '=', 'invitee')
      .execute();
    await invitee.signIn('marguerite@harbour.example', 'marguerite-pw-1');
    const ok = await callWithCookie(acceptRoute.POST, invitee.sessionCookie(), { method: 'POST', params: { token: t } });
    expect(ok).toEqual({ status: 200, body: { seriesId: DEMO_SERIES_ID, role: 'viewer' } });
  });

  it('an open link, chosen by the owner, is accepted by whoever has it', async () => {
    const r = await callRoute(invitationsRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID },
      body: { email: 'anyone@pier.test', role: 'editor', anyoneWithLink: true },
    });
    expect(r.status).toBe(201);
    expect(r.body.anyoneWithLink).toBe(true);
    const pending = await callRoute(invitationsRoute.GET, { as: 'owner', params: { seriesId: DEMO_SERIES_ID } });
    expect(pending.body.find((i: { email: string }) => i.email === 'anyone@pier.test')).toMatchObject({ anyoneWithLink: true });
    await expect.poll(async () => (await mail.read()).some((x) => x.to === 'anyone@pier.test')).toBe(true);
    const sent = (await mail.read()).find((x) => x.to === 'anyone@pier.test')!;
    const link = sent.text.match(/\/invite\/([A-Za-z0-9_-]+)/)![1]!;
    const ok = await callRoute(acceptRoute.POST, { method: 'POST', as: 'outsider', params: { token: link } });
    expect(ok.status).toBe(200);
  });

  it('by default an invitation is tied to its address, and its e-mail says so', async () => {
    const r = await callRoute(invitationsRoute.POST, {
      method: 'POST',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID },
      body: { email: 'tied@pier.test', role: 'viewer' },
    });
    expect(r.body.anyoneWithLink).toBe(false);
    await expect.poll(async () => (await mail.read()).some((x) => x.to === 'tied@pier.test')).toBe(true);
    const sent = (await mail.read()).find((x) => x.to === 'tied@pier.test')!;
    expect(sent.text).toContain('for the account with this address (tied@pier.test)');
    const link = sent.text.match(/\/invite\/([A-Za-z0-9_-]+)/)![1]!;
    expect((await callRoute(acceptRoute.POST, { method: 'POST', as: 'outsider', params: { token: link } })).status).toBe(403);
  });
});

describe('clean text in the JSON routes', () => {
  it('a title with NUL or a lone surrogate is 422 with a clear message, and nothing is stored', async () => {
    const before = await countRows(db, ['series', 'gags', 'comments']);
    const nul = await callRoute(seriesRoute.POST, { method: 'POST', as: 'owner', body: { title: 'Tea\u0000Party' } });
    expect(nul.status).toBe(422);
    expect(nul.body.error).toBe('The title contains a control character (U+0000); remove it.');
    const lone = await callRoute(gagRoute.PATCH, {
      method: 'PATCH',
      as: 'owner',
      params: { gagId: 'demo-gag-01' },
      body: { title: 'Tea \ud83e Party' },
    });
    expect(lone.status).toBe(422);
    expect(lone.body.error).toMatch(/unpaired UTF-16 surrogate/);
    const escape = await callRoute(commentsRoute.POST, {
      method: 'POST',
      as: 'editor',
      params: { gagId: 'demo-gag-01' },
      body: { body: 'Looks \u001b[2Jfine', target: 'gag' },
    });
    expect(escape.status).toBe(422);
    expect(escape.body.error).toBe('The comment contains a control character (U+001B); remove it.');
    expect(await countRows(db, ['series', 'gags', 'comments'])).toEqual(before);
    const g = await db.selectFrom('gags').select('title').where('id', '=', 'demo-gag-01').executeTakeFirstOrThrow();
    expect(g.title).not.toContain('\ud83e');
  });

  it('long texts keep their tabs and line breaks', async () => {
    const c = await callRoute(commentsRoute.POST, {
      method: 'POST',
      as: 'editor',
      params: { gagId: 'demo-gag-01' },
      body: { body: 'Panel 2:\n\tthe gull reads late.', target: 'gag' },
    });
    expect(c.status).toBe(201);
    const g = await callRoute(gagRoute.PATCH, {
      method: 'PATCH',
      as: 'owner',
      params: { gagId: 'demo-gag-01' },
      body: { beats: [{ kind: 'turn', note: 'The wave.\nThe crab ducks.' }] },
    });
    expect(g.status).toBe(200);
    const title = await callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'owner', params: { gagId: 'demo-gag-01' }, body: { title: 'Two\nlines' } });
    expect(title.status).toBe(422);
    expect(title.body.error).toBe('The title is one line: no line breaks or tabs.');
  });
});
