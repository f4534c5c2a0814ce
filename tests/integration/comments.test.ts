import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as commentRoute from '@/app/api/comments/[commentId]/route';
import * as commentsRoute from '@/app/api/gags/[gagId]/comments/route';
import { callRoute } from '../support/call-route';
import { startMailFake } from '../support/mail-fake';
import { DEMO_SERIES_ID, freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
let mail: Awaited<ReturnType<typeof startMailFake>>;
const GAG = 'demo-gag-07';
beforeAll(async () => {
  mail = await startMailFake();
  db = await freshDb();
});
afterAll(async () => {
  await mail?.stop();
});

const post = (as: 'editor' | 'cocreator' | 'owner' | 'viewer', body: Record<string, unknown>) =>
  callRoute(commentsRoute.POST, { method: 'POST', as, params: { gagId: GAG }, body });

describe('comments', () => {
  it('pins a thread to a panel of a pass, and a reply takes its pin', async () => {
    const pass = await db.selectFrom('passes').select('id').where('gagId', '=', GAG).where('number', '=', 2).executeTakeFirstOrThrow();
    const t = await post('editor', { body: 'The turn is hidden behind the wave.', target: 'panel', passId: pass.id, panel: 2 });
    expect(t.status).toBe(201);
    expect(t.body).toMatchObject({ target: 'panel', passNumber: 2, panel: 2, author: 'Ivo Sand' });
    const reply = await post('cocreator', { body: 'Raising the horizon.', parentId: t.body.id });
    expect(reply.body).toMatchObject({ target: 'panel', passId: pass.id, panel: 2, parentId: t.body.id });
    const threads = await callRoute(commentsRoute.GET, { as: 'viewer', params: { gagId: GAG } });
    const mine = threads.body.find((x: { id: string }) => x.id === t.body.id);
    expect(mine.replies.map((r: { body: string }) => r.body)).toEqual(['Raising the horizon.']);
    expect(threads.body.every((x: { parentId: string | null }) => x.parentId === null)).toBe(true);
  });

  it('beats and points need what they point at; a pass of another gag is refused', async () => {
    expect((await post('editor', { body: 'x', target: 'beat' })).status).toBe(422);
    expect((await post('editor', { body: 'x', target: 'point', passId: 'p', panel: 1 })).status).toBe(422);
    const other = await db.selectFrom('passes').select('id').where('gagId', '=', 'demo-gag-05').executeTakeFirstOrThrow();
    expect((await post('editor', { body: 'x', target: 'pass', passId: other.id })).status).toBe(422);
    expect((await post('editor', { body: 'Needs a clearer turn.', target: 'beat', beat: 'turn' })).status).toBe(201);
  });

  it('viewers cannot comment', async () => {
    expect((await post('viewer', { body: 'Love it' })).status).toBe(403);
  });

  it('@mentions a member, who gets an e-mail', async () => {
    const r = await post('editor', { body: '@Tam Quill can you look at the payoff? @owner too.' });
    expect(r.body.mentioned.sort()).toEqual(['demo-user-cocreator', 'demo-user-owner']);
    await expect.poll(async () => (await mail.read()).filter((m) => m.subject === 'Ivo Sand mentioned you on “Sugar Cube”').length).toBe(2);
    const to = (await mail.read()).map((m) => m.to).sort();
    expect(to).toEqual(['cocreator@quadrille.test', 'owner@quadrille.test']);
  });

  it('nobody who turned notifications off is mailed', async () => {
    await db.updateTable('users').set({ notifyEmail: 0 }).where('id', '=', 'demo-user-cocreator').execute();
    const before = (await mail.read()).length;
    await post('owner', { body: 'Thanks @Tam Quill' });
    await new Promise((r) => setTimeout(r, 300));
    expect((await mail.read()).length).toBe(before);
  });

  it('edit your own only; resolve and reopen a thread', async () => {
    const c = await post('editor', { body: 'First thought' });
    const own = await callRoute(commentRoute.PATCH, {
      method: 'PATCH',
      as: 'editor',
      params: { commentId: c.body.id },
      body: { body: 'Second thought' },
    });
    expect(own.body).toMatchObject({ body: 'Second thought', editedAt: expect.any(String) });
    const other = await callRoute(commentRoute.PATCH, { method: 'PATCH', as: 'owner', params: { commentId: c.body.id }, body: { body: 'Hijack' } });
    expect(other.status).toBe(403);
    const resolved = await callRoute(commentRoute.PATCH, {
      method: 'PATCH',
      as: 'owner',
      params: { commentId: c.body.id },
      body: { resolved: true },
    });
    expect(resolved.body).toMatchObject({ resolvedBy: 'Nell Harrow' });
    const reopened = await callRoute(commentRoute.PATCH, {
      method: 'PATCH',
      as: 'cocreator',
      params: { commentId: c.body.id },
      body: { resolved: false },
    });
    expect(reopened.body.resolvedAt).toBeNull();
  });
});

describe('mentions: the answer says whom they reached and what matched nobody', () => {
  it('"@Nell" is the member whose first name is Nell: she is told, and the answer says so', async () => {
    await db.updateTable('users').set({ notifyEmail: 1 }).execute();
    const before = (await mail.read()).length;
    const r = await post('editor', { body: '@Nell the payoff needs Kettle’s face.' });
    expect(r.status).toBe(201);
    expect(r.body.mentions).toEqual({
      matched: [{ mention: '@Nell', userId: 'demo-user-owner', name: 'Nell Harrow' }],
      unmatched: [],
      ambiguous: [],
    });
    expect(r.body.notified).toEqual([{ userId: 'demo-user-owner', name: 'Nell Harrow' }]);
    expect(r.body.mentioned).toEqual(['demo-user-owner']);
    await expect.poll(async () => (await mail.read()).length).toBe(before + 1);
    const sent = (await mail.read()).find((m) => m.text.includes('the payoff needs Kettle'))!;
    expect(sent.to).toBe('owner@quadrille.test');
    // The mail says where the setting really is: the Notifications section of this series' Members page.
    expect(sent.text).toContain(`/series/${DEMO_SERIES_ID}/members#notifications`);
    expect(sent.html).toContain(`/series/${DEMO_SERIES_ID}/members#notifications`);
  });

  it('a mention that matches nobody, or several members, is listed as such and tells no one', async () => {
    const now = new Date().toISOString();
    await db
      .insertInto('users')
      .values({ id: 'u-tam-reed', email: 'tam.reed@pier.test', name: 'Tam Reed', passwordHash: 'x', createdAt: now })
      .execute();
    await db.insertInto('memberships').values({ seriesId: DEMO_SERIES_ID, userId: 'u-tam-reed', role: 'viewer', createdAt: now }).execute();
    const before = (await mail.read()).length;
    const r = await post('editor', { body: '@Nel and @Tam: the horizon. @Tam Reed, you too. Mail me at ivo@pier.test' });
    expect(r.status).toBe(201);
    expect(r.body.mentions).toEqual({
      matched: [{ mention: '@Tam Reed', userId: 'u-tam-reed', name: 'Tam Reed' }],
      unmatched: ['@Nel'],
      ambiguous: [{ mention: '@Tam', names: ['Tam Quill', 'Tam Reed'] }],
    });
    expect(r.body.notified).toEqual([{ userId: 'u-tam-reed', name: 'Tam Reed' }]);
    await expect.poll(async () => (await mail.read()).length).toBe(before + 1);
    expect((await mail.read()).filter((m) => m.text.includes('the horizon')).map((m) => m.to)).toEqual(['tam.reed@pier.test']);
  });

  it('the author and people with notifications off are matched but not listed as told', async () => {
    await db.updateTable('users').set({ notifyEmail: 0 }).where('id', '=', 'demo-user-cocreator').execute();
    const r = await post('editor', { body: '@Ivo note to self; @Tam Quill see above' });
    expect(r.body.mentions.matched.map((m: { userId: string }) => m.userId)).toEqual(['demo-user-editor', 'demo-user-cocreator']);
    expect(r.body.notified).toEqual([]);
  });
});

describe('presence', () => {
  it('a heartbeat says who is where and on which panel; quiet people drop off after 20 s', async () => {
    const { POST, GET } = await import('@/app/api/gags/[gagId]/presence/route');
    await callRoute(POST, { method: 'POST', as: 'editor', params: { gagId: GAG }, body: { where: 'compare' } });
    const r = await callRoute(POST, { method: 'POST', as: 'owner', params: { gagId: GAG }, body: { where: 'pass:2', tab: 'tab-a', panel: 3 } });
    expect(r.body.map((p: { name: string; where: string; panel: number | null }) => `${p.name}@${p.where}/${p.panel}`).sort()).toEqual([
      'Ivo Sand@compare/null',
      'Nell Harrow@pass:2/3',
    ]);
    const bad = await callRoute(POST, { method: 'POST', as: 'owner', params: { gagId: GAG }, body: { where: 'kitchen' } });
    expect(bad.status).toBe(422);
    const badTab = await callRoute(POST, { method: 'POST', as: 'owner', params: { gagId: GAG }, body: { where: 'page', tab: 'no spaces' } });
    expect(badTab.status).toBe(422);
    await db
      .updateTable('presenceTabs')
      .set({ seenAt: new Date(Date.now() - 21_000).toISOString() })
      .where('userId', '=', 'demo-user-editor')
      .execute();
    const later = await callRoute(GET, { as: 'viewer', params: { gagId: GAG } });
    expect(later.body.map((p: { name: string }) => p.name)).toEqual(['Nell Harrow']);
  });
});
