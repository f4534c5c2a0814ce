import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as gagRoute from '@/app/api/gags/[gagId]/route';
import * as passesRoute from '@/app/api/gags/[gagId]/passes/route';
import * as opsRoute from '@/app/api/passes/[passId]/ops/route';
import * as restoreRoute from '@/app/api/passes/[passId]/revisions/[revisionId]/restore/route';
import * as stampRoute from '@/app/api/passes/[passId]/stamp/route';
import * as activityRoute from '@/app/api/series/[seriesId]/activity/route';
import * as seriesGagsRoute from '@/app/api/series/[seriesId]/gags/route';
import { createGag } from '@/db/queries/gags';
import { listRevisions } from '@/db/queries/revisions';
import { callRoute } from '../support/call-route';
import { startMailFake } from '../support/mail-fake';
import { DEMO_SERIES_ID, type Persona, freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
let mail: Awaited<ReturnType<typeof startMailFake>>;
beforeAll(async () => {
  mail = await startMailFake();
  db = await freshDb();
});
afterAll(async () => {
  await mail?.stop();
});

const line = (id: string) => ({
  id,
  panel: 0,
  tool: 'pen',
  grey: 100,
  size: 0.6,
  points: [
    [10, 10, 0.5],
    [20, 12, 0.5],
  ],
});

async function gagWithPass(gagId: string) {
  const p = await callRoute(passesRoute.POST, { method: 'POST', as: 'cocreator', params: { gagId }, body: {} });
  await callRoute(opsRoute.POST, {
    method: 'POST',
    as: 'cocreator',
    params: { passId: p.body.id },
    body: { batchId: `first-${gagId}`, ops: [{ op: 'add', stroke: line('a') }] },
  });
  return p.body.id as string;
}
const gagStatus = async (gagId: string) => (await callRoute(gagRoute.GET, { as: 'owner', params: { gagId } })).body.status;
const stamp = (passId: string, as: Persona, decision: string, note = '') =>
  callRoute(stampRoute.POST, { method: 'POST', as, params: { passId }, body: { decision, note } });

describe('the stamp', () => {
  it('an editor stamps a pass ready to ink: the gag is ready, naming the pass and its seq', async () => {
    const passId = await gagWithPass('demo-gag-07');
    const r = await stamp(passId, 'editor', 'ready', 'Reads at a glance.');
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ decision: 'ready', passSeq: 1, passNumber: 3, by: 'Ivo Sand', clearedAt: null });
    expect(await gagStatus('demo-gag-07')).toBe('ready_to_ink');
  });

  it('the gag’s author gets the stamp by e-mail, through the SMTP fake', async () => {
    await expect.poll(async () => (await mail.read()).map((m) => m.subject)).toContain('“Sugar Cube” is ready to ink');
    const m = (await mail.read()).find((x) => x.subject === '“Sugar Cube” is ready to ink')!;
    expect(m.to).toBe('owner@quadrille.test');
    expect(m.text).toContain('Ivo Sand stamped pass 3 of “Sugar Cube”: is ready to ink.');
    expect(m.html).toContain('Reads at a glance.');
  });

  it('a later change to that pass clears the stamp and puts the gag back in review', async () => {
    const passId = await gagWithPass('demo-gag-08');
    await stamp(passId, 'owner', 'ready');
    expect(await gagStatus('demo-gag-08')).toBe('ready_to_ink');
    await callRoute(opsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { passId },
      body: { batchId: 'later', ops: [{ op: 'add', stroke: line('b') }] },
    });
    expect(await gagStatus('demo-gag-08')).toBe('in_review');
    const stamps = await db.selectFrom('stamps').selectAll().where('passId', '=', passId).execute();
    expect(stamps[0]).toMatchObject({ clearedSeq: 2 });
    const feed = await callRoute(activityRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } });
    expect(feed.body.items[0]).toMatchObject({ kind: 'stamp.cleared', by: 'Tam Quill' });
  });

  it('after a clearing, a gag already on paper keeps its status and the activity says so (one rule: afterStampCleared)', async () => {
    const gagId = 'demo-gag-11';
    const passId = await gagWithPass(gagId);
    await stamp(passId, 'editor', 'ready');
    const patch = (status: string) => callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'cocreator', params: { gagId }, body: { status } });
    expect((await patch('inked')).status).toBe(200);
    await callRoute(opsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { passId },
      body: { batchId: 'after-ink-11', ops: [{ op: 'add', stroke: line('late-ink') }] },
    });
    expect(await gagStatus(gagId)).toBe('inked');
    const feed = await callRoute(activityRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } });
    const cleared = feed.body.items.find((i: { kind: string; summary: string }) => i.kind === 'stamp.cleared' && i.summary.includes('Inked'));
    expect(cleared?.summary).toMatch(/the stamp is cleared and the gag stays “Inked”: its inked page is not affected/);
    expect(cleared?.summary).not.toMatch(/back in review/);
  });

  it('a restore is a change too', async () => {
    const passId = await gagWithPass('demo-gag-09');
    const [created] = (await listRevisions(db, passId)).filter((r) => r.reason === 'created');
    await stamp(passId, 'editor', 'ready');
    await callRoute(restoreRoute.POST, { method: 'POST', as: 'owner', params: { passId, revisionId: created!.id } });
    expect(await gagStatus('demo-gag-09')).toBe('in_review');
  });

  it('"needs another pass" sends the gag back to thumbnailing', async () => {
    const passId = await gagWithPass('demo-gag-10');
    const r = await stamp(passId, 'editor', 'again', 'Panel 3 does not turn.');
    expect(r.status).toBe(201);
    expect(await gagStatus('demo-gag-10')).toBe('thumbnailing');
  });

  it('co-creators and viewers cannot stamp; bad decisions are 422; inked gags are 409', async () => {
    const passId = await gagWithPass('demo-gag-12');
    expect((await stamp(passId, 'cocreator', 'ready')).status).toBe(403);
    expect((await stamp(passId, 'viewer', 'ready')).status).toBe(403);
    expect((await stamp(passId, 'editor', 'maybe')).status).toBe(422);
    expect(await db.selectFrom('stamps').select('id').where('passId', '=', passId).execute()).toEqual([]);
    const inked = await db.selectFrom('passes').select('id').where('gagId', '=', 'demo-gag-04').executeTakeFirstOrThrow();
    expect((await stamp(inked.id, 'owner', 'ready')).status).toBe(409);
  });
});

describe('activity feed', () => {
  it('is paginated newest first', async () => {
    const first = await callRoute(activityRoute.GET, { as: 'editor', params: { seriesId: DEMO_SERIES_ID }, url: '/x?limit=3' });
    expect(first.body.items).toHaveLength(3);
    const ids = first.body.items.map((i: { id: number }) => i.id);
    expect([...ids].sort((a, b) => b - a)).toEqual(ids);
    const next = await callRoute(activityRoute.GET, {
      as: 'editor',
      params: { seriesId: DEMO_SERIES_ID },
      url: `/x?limit=3&before=${first.body.nextBefore}`,
    });
    expect(next.body.items[0].id).toBeLessThan(ids[2]);
    const kinds = new Set([...first.body.items, ...next.body.items].map((i: { kind: string }) => i.kind));
    expect(kinds.size).toBeGreaterThan(1);
  });
});

describe('"ready to ink" comes only from a stamp', () => {
  it('an inked gag whose stamp was cleared cannot be moved back to "ready to ink" by hand (422); while it stands, it can', async () => {
    const gagId = 'demo-gag-10';
    const passId = await gagWithPass(gagId);
    expect(
      (await callRoute(stampRoute.POST, { method: 'POST', as: 'editor', params: { passId }, body: { decision: 'ready', note: '' } })).status,
    ).toBe(201);
    const patch = (status: string) => callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'cocreator', params: { gagId }, body: { status } });
    expect((await patch('inked')).status).toBe(200);
    // Inked by mistake, with the stamp still standing: back is fine.
    expect((await patch('ready_to_ink')).status).toBe(200);
    expect((await patch('inked')).status).toBe(200);
    // A later change to the approved pass clears its stamp…
    await callRoute(opsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { passId },
      body: { batchId: 'after-ink', ops: [{ op: 'add', stroke: line('late') }] },
    });
    // …and then no hand may set "ready to ink" again.
    const refused = await patch('ready_to_ink');
    expect(refused.status).toBe(422);
    expect(refused.body.error).toMatch(/stamp/);
    expect(await gagStatus(gagId)).toBe('inked');
  });
});

describe('the stamp marks on the cards', () => {
  const boardCard = async (gagId: string) =>
    ((await callRoute(seriesGagsRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } })).body as { id: string; stamp: unknown }[]).find(
      (g) => g.id === gagId,
    )!.stamp;
  async function newGagWithPass(title: string) {
    const gagId = randomUUID();
    await createGag(db, { id: gagId, seriesId: DEMO_SERIES_ID, title, premise: '' });
    return { gagId, passId: await gagWithPass(gagId) };
  }

  it('a gag never stamped has no mark; "ready" names the pass and stands until a change clears it', async () => {
    const { gagId, passId } = await newGagWithPass('Marked gag');
    expect(await boardCard(gagId)).toBeNull();
    await stamp(passId, 'editor', 'ready');
    expect(await boardCard(gagId)).toEqual({ passId, passNumber: 1, decision: 'ready', standing: true });
    await callRoute(opsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { passId },
      body: { batchId: `clear-${gagId}`, ops: [{ op: 'add', stroke: line('c') }] },
    });
    expect(await boardCard(gagId)).toEqual({ passId, passNumber: 1, decision: 'ready', standing: false });
  });

  it('"needs another pass" marks the pass sent back; a newer stamp on another pass takes over the card', async () => {
    const { gagId, passId } = await newGagWithPass('Sent-back gag');
    await stamp(passId, 'editor', 'again', 'Turn is lost.');
    expect(await boardCard(gagId)).toMatchObject({ passId, passNumber: 1, decision: 'again', standing: false });
    const second = await callRoute(passesRoute.POST, { method: 'POST', as: 'cocreator', params: { gagId }, body: { copyFrom: 1 } });
    // Stamps are ordered by their time: keep the second a millisecond later on any clock.
    await new Promise((r) => setTimeout(r, 5));
    await stamp(second.body.id, 'owner', 'ready');
    expect(await boardCard(gagId)).toMatchObject({ passId: second.body.id, passNumber: 2, decision: 'ready', standing: true });
  });
});

describe('hand status moves', () => {
  it('are told in the activity, with who moved what from where to where; a refused move tells nothing', async () => {
    const gagId = randomUUID();
    await createGag(db, { id: gagId, seriesId: DEMO_SERIES_ID, title: 'Moved by hand', premise: '' });
    const patch = (body: object) => callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'cocreator', params: { gagId }, body });
    expect((await patch({ status: 'thumbnailing' })).status).toBe(200);
    const feed = async () => (await callRoute(activityRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID } })).body.items;
    expect((await feed())[0]).toMatchObject({
      kind: 'gag.moved',
      gagId,
      by: 'Tam Quill',
      summary: 'moved “Moved by hand” from Idea to Thumbnailing',
    });
    const top = (await feed())[0].id;
    expect((await patch({ status: 'ready_to_ink' })).status).toBe(422);
    expect((await patch({ premise: 'A premise, no move.' })).status).toBe(200);
    expect((await patch({ status: 'thumbnailing' })).status).toBe(200); // the same status: no move
    expect((await feed())[0].id).toBe(top);
  });
});

describe('every status change is told in the activity, once', () => {
  type Item = { kind: string; summary: string; gagId: string | null; by: string | null };
  const latest = async (n = 5): Promise<Item[]> =>
    (await callRoute(activityRoute.GET, { as: 'viewer', params: { seriesId: DEMO_SERIES_ID }, url: `/x?limit=${n}` })).body.items;
  const patch = (gagId: string, body: Record<string, unknown>) =>
    callRoute(gagRoute.PATCH, { method: 'PATCH', as: 'cocreator', params: { gagId }, body });

  it('a move by hand names who moved which gag from where to where', async () => {
    const gagId = 'demo-gag-12'; // "Moon Steep", an idea
    expect((await patch(gagId, { status: 'thumbnailing' })).status).toBe(200);
    const [top] = await latest(1);
    expect(top).toMatchObject({ kind: 'gag.moved', gagId, by: 'Tam Quill', summary: 'moved “Moon Steep” from Idea to Thumbnailing' });
  });

  it('an edit that moves nothing, a "move" to where it is and a refused move add no entry', async () => {
    const gagId = 'demo-gag-12';
    const before = await latest();
    expect((await patch(gagId, { title: 'Moon Steep' })).status).toBe(200);
    expect((await patch(gagId, { status: 'thumbnailing' })).status).toBe(200);
    expect((await patch(gagId, { status: 'placed' })).status).toBe(422);
    expect(await latest()).toEqual(before);
  });

  it('a stamp and its clearing are one entry each, and the status agrees with them', async () => {
    const gagId = 'demo-gag-12';
    const passId = await gagWithPass(gagId);
    const before = (await latest(1))[0];
    expect((await stamp(passId, 'editor', 'ready')).status).toBe(201);
    const afterStamp = await latest(3);
    expect(afterStamp.map((i) => i.kind)).toEqual(['stamp.ready', before!.kind, expect.any(String)]);
    expect(await gagStatus(gagId)).toBe('ready_to_ink');
    await callRoute(opsRoute.POST, {
      method: 'POST',
      as: 'cocreator',
      params: { passId },
      body: { batchId: 'moon-after', ops: [{ op: 'add', stroke: line('moon') }] },
    });
    expect((await latest(2)).map((i) => i.kind)).toEqual(['stamp.cleared', 'stamp.ready']);
    expect(await gagStatus(gagId)).toBe('in_review');
    // Back to drafting by hand: told too.
    expect((await patch(gagId, { status: 'thumbnailing' })).status).toBe(200);
    expect((await latest(1))[0]).toMatchObject({ kind: 'gag.moved', summary: 'moved “Moon Steep” from In review to Thumbnailing' });
  });
});
