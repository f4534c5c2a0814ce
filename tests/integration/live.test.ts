// Live streams (Server-Sent Events) on SQLite (in-process emitter) and on
// PostgreSQL (LISTEN/NOTIFY): what arrives, who may listen, when it stops.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as passEventsRoute from '@/app/api/passes/[passId]/events/route';
import * as gagEventsRoute from '@/app/api/gags/[gagId]/events/route';
import * as seriesEventsRoute from '@/app/api/series/[seriesId]/events/route';
import * as opsRoute from '@/app/api/passes/[passId]/ops/route';
import * as commentsRoute from '@/app/api/gags/[gagId]/comments/route';
import * as memberRoute from '@/app/api/series/[seriesId]/members/[userId]/route';
import * as gagsRoute from '@/app/api/series/[seriesId]/gags/route';
import * as gagRoute from '@/app/api/gags/[gagId]/route';
import * as stampRoute from '@/app/api/passes/[passId]/stamp/route';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { createGag } from '@/db/queries/gags';
import { createPass } from '@/db/queries/passes';
import { present } from '@/db/queries/presence';
import { endSession } from '@/db/queries/sessions';
import type { LiveEvent } from '@/lib/live/bus';
import { callRoute, sessionCookie } from '../support/call-route';
import { readSse } from '../support/sse';
import { DEMO_SERIES_ID, type Persona, freshDb, personaSession, testDbKind } from '../support/test-db';
import pg from 'pg';

type Handler = (req: Request, ctx: { params: Promise<any> }) => Promise<Response>;

let db: Kysely<Database>;
const HEARTBEAT = 300;

beforeAll(async () => {
  process.env.LIVE_HEARTBEAT_MS = String(HEARTBEAT);
  db = await freshDb();
});
afterAll(() => {
  delete process.env.LIVE_HEARTBEAT_MS;
});

/** Opens a stream as a browser would and collects what it sends. */
async function open(handler: Handler, params: Record<string, string>, as: Persona, query = '') {
  const headers = new Headers();
  const cookie = await sessionCookie(as);
  if (cookie) headers.set('cookie', cookie);
  const abort = new AbortController();
  const req = new Request(`http://localhost/events${query}`, { headers, signal: abort.signal });
  const res = await handler(req, { params: Promise.resolve(params) });
  const events: LiveEvent[] = [];
  let raw = '';
  let ended = false;
  const body = res.body!;
  const done = readSse(body, { text: (t) => (raw += t), event: (e) => events.push(e as LiveEvent) }).then(() => {
    ended = true;
  });
  /** The first event matching `pred`, among those from index `from` on. */
  const waitFor = async (pred: (e: LiveEvent) => boolean, ms = 5000, from = 0) => {
    const until = Date.now() + ms;
    while (Date.now() < until) {
      const hit = events.slice(from).find(pred);
      if (hit) return hit;
      if (ended) break;
      await new Promise((r) => setTimeout(r, 20));
    }
    throw new Error(`no such event within ${ms} ms; got ${JSON.stringify(events)}`);
  };
  return {
    res,
    events,
    raw: () => raw,
    ended: () => ended,
    waitFor,
    waitEnd: async (ms = 5000) => {
      await Promise.race([done, new Promise((r) => setTimeout(r, ms))]);
      return ended;
    },
    close: async () => {
      // The tab goes away: the server sees the request aborted and ends the stream.
      abort.abort();
      await done;
    },
  };
}

async function newPass() {
  const gagId = randomUUID();
  await createGag(db, { id: gagId, seriesId: DEMO_SERIES_ID, title: 'Live gag', premise: '' });
  const pass = await createPass(db, { gagId, userId: 'demo-user-cocreator' });
  return { gagId, passId: pass.id };
}

const strokeOp = (id: string) => ({
  op: 'add',
  stroke: {
    id,
    panel: 1,
    tool: 'pen',
    grey: 80,
    size: 0.6,
    points: [
      [90, 20, 0.5],
      [100, 30, 0.5],
    ],
  },
});

describe('the pass stream', () => {
  it('answers as an event stream that proxies do not buffer, says hello with the seq, then each new seq', async () => {
    const { passId } = await newPass();
    const s = await open(passEventsRoute.GET, { passId }, 'editor');
    expect(s.res.status).toBe(200);
    expect(s.res.headers.get('content-type')).toMatch(/^text\/event-stream/);
    expect(s.res.headers.get('x-accel-buffering')).toBe('no');
    expect(s.res.headers.get('cache-control')).toContain('no-transform');
    await s.waitFor((e) => e.type === 'seq' && e.seq === 0);
    const r = await callRoute(opsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { passId },
      body: { batchId: randomUUID(), ops: [strokeOp('live-1')] },
    });
    expect(r.status).toBe(200);
    const e = await s.waitFor((x) => x.topic === `pass:${passId}` && x.seq === r.body.seq);
    expect(e.type).toBe('seq');
    // The event id is the seq, so the stream itself says where a client stands.
    expect(s.raw()).toContain(`id: ${r.body.seq}\n`);
    await s.close();
  });

  it('beats while idle, so proxies and browsers see the line is alive', async () => {
    const { passId } = await newPass();
    const s = await open(passEventsRoute.GET, { passId }, 'viewer');
    await new Promise((r) => setTimeout(r, HEARTBEAT * 2.5));
    expect(s.raw().match(/: beat\n\n/g)?.length ?? 0).toBeGreaterThanOrEqual(2);
    await s.close();
  });

  it('a retried batch (same id) is announced again under its first seq, and changes nothing', async () => {
    // Its first announcement may have died with the instance that committed it.
    const { passId } = await newPass();
    const s = await open(passEventsRoute.GET, { passId }, 'owner');
    const body = { batchId: randomUUID(), ops: [strokeOp('once')] };
    await callRoute(opsRoute.POST, { method: 'POST', as: 'cocreator', params: { passId }, body });
    await s.waitFor((e) => e.seq === 1 && e.topic === `pass:${passId}`);
    const seen = s.events.length;
    const again = await callRoute(opsRoute.POST, { method: 'POST', as: 'cocreator', params: { passId }, body });
    expect(again.body.seq).toBe(1);
    await s.waitFor((e) => e.topic === `pass:${passId}` && e.type === 'seq' && e.seq === 1, 2000, seen);
    expect(s.events.some((e) => e.topic === `pass:${passId}` && (e.seq ?? 0) > 1)).toBe(false);
    await s.close();
  });

  it('is 401 signed out, 404 to a non-member and for an unknown pass', async () => {
    const { passId } = await newPass();
    expect((await callRoute(passEventsRoute.GET, { as: 'anonymous', params: { passId } })).status).toBe(401);
    expect((await callRoute(passEventsRoute.GET, { as: 'outsider', params: { passId } })).status).toBe(404);
    expect((await callRoute(passEventsRoute.GET, { as: 'owner', params: { passId: 'nope' } })).status).toBe(404);
    expect((await callRoute(passEventsRoute.GET, { as: 'owner', params: { passId }, url: '/?tab=has%20space' })).status).toBe(422);
  });
});

describe('the gag stream', () => {
  it('tells of a new comment and of new passes', async () => {
    const { gagId } = await newPass();
    const s = await open(gagEventsRoute.GET, { gagId }, 'viewer');
    await callRoute(commentsRoute.POST, { method: 'POST', as: 'editor', params: { gagId }, body: { body: 'The turn reads late.', target: 'gag' } });
    await s.waitFor((e) => e.topic === `gag:${gagId}` && e.type === 'comments');
    await s.close();
  });

  it('carries presence: who opened the gag and on which panel, gone when the tab closes', async () => {
    const { gagId, passId } = await newPass();
    const watcher = await open(gagEventsRoute.GET, { gagId }, 'owner', '?tab=owner-tab&where=page');
    const editor = await open(passEventsRoute.GET, { passId }, 'cocreator', '?tab=co-tab&panel=2');
    const list = (
      await watcher.waitFor(
        (e) => e.type === 'presence' && Array.isArray(e.data) && (e.data as { name: string }[]).some((p) => p.name === 'Tam Quill'),
      )
    ).data as { name: string; where: string; panel: number | null }[];
    expect(list.find((p) => p.name === 'Tam Quill')).toMatchObject({ where: 'pass:1', panel: 2 });
    expect(list.find((p) => p.name === 'Nell Harrow')).toMatchObject({ where: 'page', panel: null });
    const seenBefore = watcher.events.length;
    await editor.close();
    // The tab went away: its row is deleted and the others hear of it.
    await watcher.waitFor(
      (e) => e.type === 'presence' && Array.isArray(e.data) && !(e.data as { name: string }[]).some((p) => p.name === 'Tam Quill'),
      5000,
      seenBefore,
    );
    expect((await present(db, gagId)).map((p) => p.name)).toEqual(['Nell Harrow']);
    await watcher.close();
    await expect.poll(() => present(db, gagId), { timeout: 2000 }).toEqual([]);
  });
});

describe('the series stream', () => {
  it('tells the board of a new gag', async () => {
    const s = await open(seriesEventsRoute.GET, { seriesId: DEMO_SERIES_ID }, 'viewer');
    const r = await callRoute(gagsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { seriesId: DEMO_SERIES_ID },
      body: { title: 'Tide chart', premise: '' },
    });
    expect(r.status).toBe(201);
    const e = await s.waitFor((x) => x.type === 'gags' && (x.ids ?? []).includes(r.body.id));
    expect(e.topic).toBe(`series:${DEMO_SERIES_ID}`);
    await s.close();
  });
});

describe('a status that changes reaches every open page', () => {
  it('a stamp, a clearing and a hand move each tell the board (gags) and the gag page (gag, stamps)', async () => {
    const { gagId, passId } = await newPass();
    await callRoute(opsRoute.POST, { method: 'POST', as: 'cocreator', params: { passId }, body: { batchId: randomUUID(), ops: [strokeOp('s1')] } });
    const board = await open(seriesEventsRoute.GET, { seriesId: DEMO_SERIES_ID }, 'viewer');
    const page = await open(gagEventsRoute.GET, { gagId }, 'viewer', '?tab=t-status&where=page');
    await board.waitFor((e) => e.type === 'hello');
    await page.waitFor((e) => e.type === 'hello');
    const told = async (from: [number, number]) => {
      await board.waitFor((e) => e.type === 'gags' && (e.ids ?? []).includes(gagId), 5000, from[0]);
      await page.waitFor((e) => e.type === 'gag', 5000, from[1]);
      await page.waitFor((e) => e.type === 'stamps', 5000, from[1]);
    };
    const mark = (): [number, number] => [board.events.length, page.events.length];

    let from = mark();
    const stamped = await callRoute(stampRoute.POST, { method: 'POST', as: 'editor', params: { passId }, body: { decision: 'ready', note: '' } });
    expect(stamped.status).toBe(201);
    await told(from);

    from = mark();
    await callRoute(opsRoute.POST, { method: 'POST', as: 'cocreator', params: { passId }, body: { batchId: randomUUID(), ops: [strokeOp('s2')] } });
    await told(from);

    from = mark();
    const moved = await callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'cocreator', params: { gagId }, body: { status: 'thumbnailing' } });
    expect(moved.status).toBe(200);
    await told(from);
    await board.waitFor((e) => e.type === 'activity', 5000, from[0]);
    await board.close();
    await page.close();
  });
});

describe('the board’s activity panel', () => {
  it('hears of a status moved by hand (the move is in the activity), and of a comment', async () => {
    const s = await open(seriesEventsRoute.GET, { seriesId: DEMO_SERIES_ID }, 'viewer');
    await s.waitFor((e) => e.type === 'hello');
    const from = s.events.length;
    const r = await callRoute(gagRoute.PATCH, {
      method: 'PATCH',
      as: 'cocreator',
      params: { gagId: 'demo-gag-11' },
      body: { status: 'thumbnailing' },
    });
    expect(r.status).toBe(200);
    await s.waitFor((x) => x.type === 'activity' && x.topic === `series:${DEMO_SERIES_ID}`, 5000, from);
    // A title edit moves nothing and tells the activity nothing (the board still hears of the gag).
    const mark = s.events.length;
    await callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'cocreator', params: { gagId: 'demo-gag-11' }, body: { title: 'Sideways Race' } });
    await s.waitFor((x) => x.type === 'gags', 5000, mark);
    expect(s.events.slice(mark).some((x) => x.type === 'activity')).toBe(false);
    const beforeComment = s.events.length;
    const c = await callRoute(commentsRoute.POST, { method: 'POST', as: 'editor', params: { gagId: 'demo-gag-11' }, body: { body: 'Faster?' } });
    expect(c.status).toBe(201);
    await s.waitFor((x) => x.type === 'activity', 5000, beforeComment);
    await s.close();
  });
});

describe('a session ended while its stream is open', () => {
  it('stops within one heartbeat (signed out elsewhere, or the password changed)', async () => {
    const { passId } = await newPass();
    const s = await open(passEventsRoute.GET, { passId }, 'cocreator');
    await s.waitFor((e) => e.type === 'seq');
    await endSession(db, await personaSession('cocreator'));
    const t0 = Date.now();
    expect(await s.waitEnd(HEARTBEAT * 4)).toBe(true);
    expect(Date.now() - t0).toBeLessThanOrEqual(HEARTBEAT * 2 + 200);
    expect(s.events.some((e) => e.type === 'gone')).toBe(true);
  });
});

describe('a member removed while a stream is open', () => {
  it('stops receiving at once when the removal is announced', async () => {
    const { passId } = await newPass();
    const s = await open(passEventsRoute.GET, { passId }, 'viewer');
    await s.waitFor((e) => e.type === 'seq');
    const r = await callRoute(memberRoute.DELETE, {
      method: 'DELETE',
      as: 'owner',
      params: { seriesId: DEMO_SERIES_ID, userId: 'demo-user-viewer' },
    });
    expect(r.status).toBe(204);
    await s.waitFor((e) => e.type === 'gone', 2000);
    expect(await s.waitEnd(2000)).toBe(true);
    // Nothing after the end, however much is drawn.
    const before = s.events.length;
    await callRoute(opsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { passId },
      body: { batchId: randomUUID(), ops: [strokeOp('after-removal')] },
    });
    await new Promise((r) => setTimeout(r, 200));
    expect(s.events.length).toBe(before);
  });

  it('stops within one heartbeat when nothing announced it (removed straight in the database)', async () => {
    const { passId } = await newPass();
    const s = await open(passEventsRoute.GET, { passId }, 'editor');
    await s.waitFor((e) => e.type === 'seq');
    await db.deleteFrom('memberships').where('seriesId', '=', DEMO_SERIES_ID).where('userId', '=', 'demo-user-editor').execute();
    const t0 = Date.now();
    expect(await s.waitEnd(HEARTBEAT * 4)).toBe(true);
    expect(Date.now() - t0).toBeLessThanOrEqual(HEARTBEAT * 2 + 200);
    expect(s.events.some((e) => e.type === 'gone')).toBe(true);
  });
});

describe.runIf(testDbKind() === 'postgres')('fan-out between instances on PostgreSQL', () => {
  it('an event NOTIFYed by another instance reaches this instance`s streams', async () => {
    const { gagId } = await newPass();
    const s = await open(gagEventsRoute.GET, { gagId }, 'owner');
    await s.waitFor((e) => e.type === 'hello');
    // "Instance B": its own connection, sending the NOTIFY its publish() would send.
    const other = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await other.connect();
    await other.query(`select pg_notify('quadrille_live', $1)`, [JSON.stringify([{ topic: `gag:${gagId}`, type: 'comments' }])]);
    await other.end();
    await s.waitFor((e) => e.topic === `gag:${gagId}` && e.type === 'comments');
    await s.close();
  });
});
