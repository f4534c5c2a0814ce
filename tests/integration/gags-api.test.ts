import { beforeAll, describe, expect, it } from 'vitest';
import * as gagRoute from '@/app/api/gags/[gagId]/route';
import * as healthRoute from '@/app/api/health/route';
import * as gagsRoute from '@/app/api/series/[seriesId]/gags/route';
import * as seriesRoute from '@/app/api/series/route';
import * as usersRoute from '@/app/api/users/route';
import { createPass } from '@/db/queries/passes';
import { stampPass } from '@/db/queries/stamps';
import { callRoute } from '../support/call-route';
import { DEMO_SERIES_ID, PERSONAS, freshDb, testDbKind } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  db = await freshDb();
});

async function gagRow(id: string) {
  const gag = await db.selectFrom('gags').selectAll().where('id', '=', id).executeTakeFirst();
  const beats = await db.selectFrom('beats').selectAll().where('gagId', '=', id).orderBy('kind').execute();
  return { gag, beats };
}

describe('health', () => {
  it('answers ok with the database kind', async () => {
    const r = await callRoute(healthRoute.GET, {});
    expect(r).toEqual({ status: 200, body: { ok: true, db: testDbKind() } });
  });
});

describe('series', () => {
  it('lists my series with my role', async () => {
    const r = await callRoute(seriesRoute.GET, { as: 'editor' });
    expect(r.body).toEqual([{ id: DEMO_SERIES_ID, title: 'Kettle Crab', role: 'editor' }]);
    const o = await callRoute(seriesRoute.GET, { as: 'outsider' });
    expect(o.body.map((s: { title: string }) => s.title)).toEqual(['Lantern Moth']);
  });

  it('creating a series makes me its owner', async () => {
    const r = await callRoute(seriesRoute.POST, { method: 'POST', as: 'viewer', body: { title: '  Tide Pool Notes ' } });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ title: 'Tide Pool Notes', role: 'owner' });
    const mine = await callRoute(seriesRoute.GET, { as: 'viewer' });
    expect(mine.body).toContainEqual({ id: r.body.id, title: 'Tide Pool Notes', role: 'owner' });
  });

  it('a blank title is 422 and creates nothing', async () => {
    const before = await db.selectFrom('series').select('id').execute();
    const r = await callRoute(seriesRoute.POST, { method: 'POST', as: 'owner', body: { title: ' ' } });
    expect(r.status).toBe(422);
    expect(r.body.issues[0].path).toEqual(['title']);
    expect(await db.selectFrom('series').select('id').execute()).toEqual(before);
  });
});

describe('gags', () => {
  it('lists gags in board order with four beats each', async () => {
    const r = await callRoute(gagsRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } });
    expect(r.status).toBe(200);
    expect(r.body).toHaveLength(12);
    const positions = r.body.map((g: { position: number }) => g.position);
    expect([...positions].sort((a, b) => a - b)).toEqual(positions);
    for (const g of r.body) expect(g.beats.map((b: { kind: string }) => b.kind)).toEqual(['setup', 'build', 'turn', 'payoff']);
  });

  it('creates a gag at the end of the board as an idea with empty beats', async () => {
    const r = await callRoute(gagsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { seriesId: DEMO_SERIES_ID },
      body: { title: 'Barnacle Band', premise: 'Barnacles form a band on the teapot.' },
    });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ title: 'Barnacle Band', status: 'idea', beatsWritten: 0, position: 13 });
    expect(r.body.beats).toHaveLength(4);
  });

  it("names each gag's newest pass and newest stamp, as each gag's own rows say, and the same as the gag's own read", async () => {
    // A gag with passes 1–3, "ready" on pass 2 and then "again" on pass 3: the card shows pass 3 and the "again".
    const made = await callRoute(gagsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { seriesId: DEMO_SERIES_ID },
      body: { title: 'Lid Lift', premise: 'The crab lifts the kettle lid to look out.' },
    });
    const gagId = made.body.id as string;
    const passes = [];
    for (let i = 0; i < 3; i++) passes.push(await createPass(db, { gagId, userId: PERSONAS.cocreator.id }));
    await stampPass(db, { passId: passes[1]!.id, userId: PERSONAS.editor.id, decision: 'ready', note: '' });
    await stampPass(db, { passId: passes[2]!.id, userId: PERSONAS.editor.id, decision: 'again', note: 'The lid hides the eyes.' });

    const board = (await callRoute(gagsRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } })).body as any[];
    const card = board.find((g) => g.id === gagId);
    expect(card.latestPass).toMatchObject({ id: passes[2]!.id, number: 3 });
    expect(card.stamp).toEqual({ passId: passes[2]!.id, passNumber: 3, decision: 'again', standing: false });
    expect((await callRoute(gagRoute.GET, { as: 'viewer', params: { gagId } })).body).toEqual(card);

    for (const g of board) {
      const newest = await db
        .selectFrom('passes')
        .select(['id', 'number', 'seq'])
        .where('gagId', '=', g.id)
        .orderBy('number', 'desc')
        .executeTakeFirst();
      expect(g.latestPass, g.title).toEqual(newest ?? null);
      const stamp = await db
        .selectFrom('stamps as s')
        .innerJoin('passes as p', 'p.id', 's.passId')
        .select(['s.passId', 'p.number', 's.decision', 's.clearedAt'])
        .where('s.gagId', '=', g.id)
        .orderBy('s.createdAt', 'desc')
        .orderBy('s.id', 'desc')
        .executeTakeFirst();
      expect(g.stamp, g.title).toEqual(
        stamp
          ? {
              passId: stamp.passId,
              passNumber: stamp.number,
              decision: stamp.decision,
              standing: stamp.decision === 'ready' && stamp.clearedAt === null,
            }
          : null,
      );
    }
    expect(board.filter((g) => g.stamp?.standing).length, 'the demo has standing stamps').toBeGreaterThan(0);
  });

  it('patches title, premise and beat notes together, and bumps updatedAt', async () => {
    const before = await gagRow('demo-gag-10');
    const r = await callRoute(gagRoute.PATCH, {
      method: 'PATCH',
      as: 'owner',
      params: { gagId: 'demo-gag-10' },
      body: { title: 'Handle Trapeze', beats: [{ kind: 'payoff', note: 'Kettle lands in a cup, bows.' }] },
    });
    expect(r.status).toBe(200);
    expect(r.body.title).toBe('Handle Trapeze');
    expect(r.body.beats.find((b: { kind: string }) => b.kind === 'payoff').note).toBe('Kettle lands in a cup, bows.');
    expect(r.body.beats.find((b: { kind: string }) => b.kind === 'setup').note).toBe('Kettle eyes the handle from below.');
    expect(r.body.updatedAt > before.gag!.updatedAt).toBe(true);
    expect(r.body.beatsWritten).toBe(2);
  });

  it('refuses "ready to ink" by hand with 422 and changes nothing', async () => {
    const before = await gagRow('demo-gag-07');
    const r = await callRoute(gagRoute.PATCH, {
      method: 'PATCH',
      as: 'owner',
      params: { gagId: 'demo-gag-07' },
      body: { status: 'ready_to_ink', title: 'Sneaky rename' },
    });
    expect(r.status).toBe(422);
    expect(r.body.error).toMatch(/stamp/);
    expect(await gagRow('demo-gag-07')).toEqual(before);
  });

  it('allows a legal status move', async () => {
    const r = await callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'cocreator', params: { gagId: 'demo-gag-05' }, body: { status: 'inked' } });
    expect(r.status).toBe(200);
    expect(r.body.status).toBe('inked');
  });

  it.each([
    ['malformed JSON', { rawBody: '{"title":' }],
    ['an unknown field', { body: { colour: 'red' } }],
    ['an empty patch', { body: {} }],
    ['an unknown beat kind', { body: { beats: [{ kind: 'punchline', note: 'x' }] } }],
    ['a title too long', { body: { title: 'x'.repeat(121) } }],
  ])('422 for %s, nothing changes', async (_name, input) => {
    const before = await gagRow('demo-gag-08');
    const r = await callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'owner', params: { gagId: 'demo-gag-08' }, ...input });
    expect(r.status).toBe(422);
    expect(typeof r.body.error).toBe('string');
    expect(await gagRow('demo-gag-08')).toEqual(before);
  });

  it('an unknown gag is 404', async () => {
    const r = await callRoute(gagRoute.GET, { as: 'owner', params: { gagId: 'no-such-gag' } });
    expect(r.status).toBe(404);
  });

  it('a gag of another series is 404, even to an owner elsewhere', async () => {
    const r = await callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'owner', params: { gagId: 'demo-gag-21' }, body: { title: 'x' } });
    expect(r.status).toBe(404);
  });

  it('the owner deletes a gag: 204, then 404', async () => {
    const r = await callRoute(gagRoute.DELETE, { method: 'DELETE', as: 'owner', params: { gagId: 'demo-gag-11' } });
    expect(r.status).toBe(204);
    expect((await callRoute(gagRoute.GET, { as: 'owner', params: { gagId: 'demo-gag-11' } })).status).toBe(404);
    expect(await gagRow('demo-gag-11')).toEqual({ gag: undefined, beats: [] });
  });
});

describe('sign-up', () => {
  it('creates an account once; the same address again is 409', async () => {
    const body = { name: 'Pier Keeper', email: 'Keeper@Pier.test', password: 'a-long-password' };
    const first = await callRoute(usersRoute.POST, { method: 'POST', body });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ email: 'keeper@pier.test', name: 'Pier Keeper' });
    expect(first.body.passwordHash).toBeUndefined();
    const again = await callRoute(usersRoute.POST, { method: 'POST', body: { ...body, email: 'keeper@pier.test' } });
    expect(again.status).toBe(409);
  });
  it('a short password is 422', async () => {
    const r = await callRoute(usersRoute.POST, { method: 'POST', body: { name: 'A', email: 'a@pier.test', password: 'short' } });
    expect(r.status).toBe(422);
  });
});

describe('changes from other sites', () => {
  const GAG_ID = 'demo-gag-09';
  const patch = async (headers: Record<string, string>, body: string) => {
    const { PATCH } = await import('@/app/api/gags/[gagId]/route');
    const { sessionCookie } = await import('../support/call-route');
    const h = new Headers({ cookie: (await sessionCookie('owner'))!, host: 'quadrille.test', ...headers });
    const res = await PATCH(new Request('http://quadrille.test/api/gags/x', { method: 'PATCH', headers: h, body }), {
      params: Promise.resolve({ gagId: GAG_ID }),
    });
    return { status: res.status, body: await res.json() };
  };

  it('refuses a change whose Origin is another site (403), and nothing changes', async () => {
    const r = await patch({ origin: 'https://elsewhere.test', 'content-type': 'application/json' }, JSON.stringify({ premise: 'Forged' }));
    expect(r.status).toBe(403);
    const ok = await patch({ origin: 'http://quadrille.test', 'content-type': 'application/json' }, JSON.stringify({ premise: 'Kettle pours.' }));
    expect(ok.status).toBe(200);
    expect(ok.body.premise).toBe('Kettle pours.');
  });

  it('takes bodies only as application/json (415 for a form or plain text)', async () => {
    expect((await patch({ 'content-type': 'text/plain' }, JSON.stringify({ premise: 'Plain' }))).status).toBe(415);
    expect((await patch({ 'content-type': 'application/x-www-form-urlencoded' }, 'premise=Form')).status).toBe(415);
  });
});
