// Hostile bodies for every JSON route (issue 13; OWASP ASVS 4.0 V5 validation, V13 API): fast-check
// makes bodies from the route's own zod schema and past it (tests/support/hostile.ts), sent in-process
// as the owner mostly, sometimes as a co-creator, an outsider or nobody. Every answer must be 2xx or
// 4xx, a 4xx must carry a JSON `{ error }`, a refused request must leave every table as it was (row
// counts and content hashes), and no accepted one may tie rows of two series together.
// Short inside `npm test`; SOAK=1 sends 1,000 bodies a route.
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { closeDb } from '@/db/client';
import { DEMO_VOLUME_ID } from '@/db/seed/demo-data';
import { checklistItems } from '@/db/queries/review';
import { createComment } from '@/db/queries/comments';
import { addEntry, createVolume } from '@/db/queries/volumes';
import { createGag } from '@/db/queries/gags';
import { createPass } from '@/db/queries/passes';
import { applyBatch } from '@/db/queries/batches';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import * as uploadsRoute from '@/app/api/series/[seriesId]/uploads/route';
import { callRoute, sessionCookie } from '../../support/call-route';
import { hostileBodies, type HostileBody } from '../../support/hostile';
import { type JsonRoute, discoverJsonRoutes } from '../../support/json-routes';
import { startMailFake } from '../../support/mail-fake';
import { startS3Fake } from '../../support/s3-fake';
import { arbitraryFromSchema, jsonSchemaOf } from '../../support/schema-arbitrary';
import { SOAK, recordFigures, scale } from '../../support/soak';
import { changedTables, crossSeriesLeaks, tableState, type TableState } from '../../support/table-state';
import { DEMO_SERIES_ID, OTHER_SERIES_ID, type Persona, freshDb, testDbKind } from '../../support/test-db';

const RUNS = scale(30, 1_000);
// Failed password checks are counted even when the request is refused: that is the throttle working
// (OWASP ASVS 4.0 V2.2.1), not a refused request writing.
const COUNTED_WHEN_REFUSED = ['sign_in_failures', 'sign_in_client_attempts'];
// Mostly someone the route lets through to its body check; sometimes someone it must stop first.
const PERSONAS: Persona[] = ['owner', 'owner', 'owner', 'owner', 'owner', 'owner', 'cocreator', 'cocreator', 'outsider', 'anonymous'];

let db: Awaited<ReturnType<typeof freshDb>>;
let ready = false;
let mail: Awaited<ReturnType<typeof startMailFake>>;
let s3: Awaited<ReturnType<typeof startS3Fake>>;
let params: Record<string, string> = {};
let near: string[] = [];
let ids: string[] = [];
let state: TableState;
let cookies: Partial<Record<Persona, string | undefined>> = {};
const discovery = await discoverJsonRoutes();
const tally = { tried: 0, ok: 0, refused: 0, serverErrors: 0, kinds: {} as Record<string, number>, accepted: {} as Record<string, number> };

async function upload(seriesId: string, as: Persona, shade: number): Promise<string> {
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: { r: shade, g: 40, b: 90 } } })
    .png()
    .toBuffer();
  const form = new FormData();
  form.append('file', new File([new Uint8Array(png)], 'scan.png', { type: 'image/png' }));
  const r = await callRoute(uploadsRoute.POST, { method: 'POST', as, params: { seriesId }, form });
  expect(r.status).toBe(201);
  return r.body.id;
}

beforeAll(async () => {
  mail = await startMailFake(); // invitations and mentions send mail
  s3 = await startS3Fake(); // lightboxes name uploads
});

/** A fresh seeded database with the records the routes' paths name, and the ids bodies may smuggle. */
async function freshFixture() {
  await closeDb();
  cookies = {};
  db = await freshDb();
  // The resources the routes' paths name, all in the demo series: a gag still at "idea" (so it can be
  // stamped) with a pass of one stroke and a comment, a volume of two pages, a viewer to change.
  const gagId = randomUUID();
  await createGag(db, { id: gagId, seriesId: DEMO_SERIES_ID, title: 'Hostile gag', premise: '' });
  const pass = await createPass(db, { gagId, userId: 'demo-user-owner' });
  const stroke = { id: 'm1', panel: 0, tool: 'pen' as const, grey: 100, size: 1, points: [[10, 10, 0.5] as [number, number, number]] };
  await applyBatch(db, { passId: pass.id, batchId: 'seed', ops: [{ op: 'add', stroke }], userId: 'demo-user-owner', spec: DEFAULT_PAGE_SPEC });
  const second = await createPass(db, { gagId, userId: 'demo-user-owner' });
  const volume = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Hostile volume', deadline: '2027-03-13' });
  const entry = await addEntry(db, volume.id, DEMO_SERIES_ID, { kind: 'blank' });
  const entry2 = await addEntry(db, volume.id, DEMO_SERIES_ID, { kind: 'title' });
  const comment = await createComment(db, {
    gagId,
    seriesId: DEMO_SERIES_ID,
    authorId: 'demo-user-owner',
    body: 'Panel 2 reads late.',
    target: 'gag',
  });
  const memberId = randomUUID();
  const now = new Date().toISOString();
  await db
    .insertInto('users')
    .values({ id: memberId, email: `${memberId}@pier.test`, name: 'Member', passwordHash: 'x', createdAt: now })
    .execute();
  await db.insertInto('memberships').values({ seriesId: DEMO_SERIES_ID, userId: memberId, role: 'viewer', createdAt: now }).execute();
  // A final page of the gag (its files are not read by the JSON routes, so no storage is needed).
  const finalPageId = randomUUID();
  await db
    .insertInto('finalPages')
    .values({
      id: finalPageId,
      seriesId: DEMO_SERIES_ID,
      gagId,
      entryId: null,
      sha256: 'f'.repeat(64),
      name: 'page.tif',
      mime: 'image/tiff',
      bytes: 1000,
      width: 1000,
      height: 1000,
      bitsPerPixel: 8,
      colour: 'grey',
      ppi: 300,
      keptKey: 'k',
      keptMime: 'image/tiff',
      displayKey: 'd',
      previewKey: 'p',
      fitTo: 'trim',
      fitX: 0,
      fitY: 0,
      fitScale: 1,
      fitRotation: 0,
      fittedAt: null,
      fittedBy: null,
      current: 1,
      madeCurrentAt: now,
      madeCurrentBy: 'demo-user-owner',
      createdBy: 'demo-user-owner',
      createdAt: now,
    })
    .execute();
  params = {
    seriesId: DEMO_SERIES_ID,
    gagId,
    passId: pass.id,
    volumeId: volume.id,
    entryId: entry.id,
    commentId: comment.id,
    userId: memberId,
    finalPageId,
  };
  const uploadId = await upload(DEMO_SERIES_ID, 'owner', 10);
  near = [
    gagId,
    pass.id,
    second.id,
    entry.id,
    entry2.id,
    comment.id,
    memberId,
    uploadId,
    'm1',
    ...(await checklistItems(db, DEMO_SERIES_ID)).map((i) => i.id),
  ];

  // Ids of everything else, of this series and of the other one, for bodies to smuggle.
  const otherGag = await db.selectFrom('gags').select('id').where('seriesId', '=', OTHER_SERIES_ID).executeTakeFirstOrThrow();
  await createComment(db, { gagId: otherGag.id, seriesId: OTHER_SERIES_ID, authorId: 'demo-user-outsider', body: 'Elsewhere.', target: 'gag' });
  const otherVolume = await createVolume(db, { seriesId: OTHER_SERIES_ID, title: 'Elsewhere', deadline: '2027-05-01' });
  await addEntry(db, otherVolume.id, OTHER_SERIES_ID, { gagId: otherGag.id });
  await upload(OTHER_SERIES_ID, 'outsider', 20);
  const column = async (table: 'gags' | 'passes' | 'comments' | 'volumes' | 'volumeEntries' | 'uploads' | 'users' | 'series') =>
    (await db.selectFrom(table).select('id').execute()).map((r) => String(r.id));
  ids = [
    ...(await column('gags')),
    ...(await column('passes')),
    ...(await column('comments')),
    ...(await column('volumes')),
    ...(await column('volumeEntries')),
    ...(await column('uploads')),
    ...(await column('users')),
    ...(await column('series')),
    ...(await checklistItems(db, OTHER_SERIES_ID)).map((i) => i.id),
    DEMO_VOLUME_ID,
  ];
  ids = [...new Set(ids)].slice(0, 400);
  state = await tableState(db);
  expect(await crossSeriesLeaks(db)).toEqual({});
  ready = true;
}

afterAll(async () => {
  await mail?.stop();
  await s3?.close();
  recordFigures(`hostile bodies (${testDbKind()})`, {
    routes: discovery.routes.length,
    bodiesPerRoute: RUNS,
    requests: tally.tried,
    '2xx': tally.ok,
    '4xx': tally.refused,
    '5xx': tally.serverErrors,
    // A route no generated body got through would mean the generator never reaches its handler's own work.
    'routes that accepted none':
      discovery.routes
        .filter((r) => !tally.accepted[r.route])
        .map((r) => r.route)
        .join(', ') || 'none',
    ...Object.fromEntries(Object.entries(tally.kinds).map(([k, n]) => [`kind: ${k}`, n])),
  });
});

function urlOf(route: JsonRoute): string {
  return route.route.split(' ')[1]!.replace(/:(\w+)/g, (_m, name: string) => params[name] ?? name);
}

// Each persona's cookie, made once: making one may start a session (a row), which must not happen
// between a request's before and after. An accepted request may end sessions (a password change), so
// the cookies are made again after one, and the baseline taken again.
async function cookieOf(as: Persona): Promise<string | undefined> {
  if (!(as in cookies)) {
    cookies[as] = await sessionCookie(as);
    state = await tableState(db);
  }
  return cookies[as];
}

async function jobsSettled(): Promise<void> {
  for (const until = Date.now() + 60_000; Date.now() < until;) {
    const open = await db.selectFrom('printJobs').select('id').where('state', 'in', ['queued', 'running']).executeTakeFirst();
    if (!open) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('a print job did not finish within 60 s');
}

async function send(route: JsonRoute, b: HostileBody, as: Persona): Promise<{ status: number; text: string; type: string }> {
  const headers = new Headers();
  const cookie = await cookieOf(as);
  if (cookie) headers.set('cookie', cookie);
  if (b.contentType) headers.set('content-type', b.contentType);
  if (b.origin) headers.set('origin', b.origin);
  const req = new Request(`http://localhost${urlOf(route)}`, { method: route.method, headers, body: b.body });
  const routeParams = Object.fromEntries(route.params.map((p) => [p, params[p]!]));
  const res = await route.handler(req, { params: Promise.resolve(routeParams) });
  return { status: res.status, text: await res.text(), type: res.headers.get('content-type') ?? '' };
}

describe('the JSON routes are found', () => {
  it('every mutating handler in app/api declares its body schema to the wrapper, where the test can load it', () => {
    expect(discovery.unresolved, 'body schemas the test cannot load').toEqual([]);
    expect(discovery.withoutBody, 'mutating handlers with neither a body schema nor a reason in BODYLESS').toEqual([]);
    expect(discovery.routes.length).toBeGreaterThanOrEqual(20);
  });
});

describe(`hostile bodies, ${RUNS} a route`, () => {
  for (const route of discovery.routes) {
    it(
      route.route,
      async () => {
        // Every request hashes every table: the soak gives each route a fresh database so they stay small.
        if (SOAK || !ready) await freshFixture();
        const valid = arbitraryFromSchema(jsonSchemaOf(route.schema), { near, ids });
        await fc.assert(
          fc.asyncProperty(hostileBodies(valid, [...near, ...ids]), fc.constantFrom(...PERSONAS), async (b, as) => {
            const res = await send(route, b, as);
            const after = await tableState(db);
            const before = state;
            state = after;
            tally.tried += 1;
            tally.kinds[b.kind] = (tally.kinds[b.kind] ?? 0) + 1;
            const shown = typeof b.body === 'string' ? b.body.slice(0, 300) : `<${b.body.length} bytes>`;
            const what = `${route.route} as ${as}, ${b.kind} (${b.contentType ?? 'no type'}${b.origin ? `, Origin ${b.origin}` : ''}): ${shown}`;
            if (res.status >= 500) tally.serverErrors += 1;
            expect(res.status, `${what}\n→ ${res.status} ${res.text.slice(0, 300)}`).toBeLessThan(500);
            expect(res.status < 300 || res.status >= 400, `${what}\n→ ${res.status}: neither 2xx nor 4xx`).toBe(true);
            expect(res.status, `${what}\n→ ${res.status}`).toBeGreaterThanOrEqual(200);
            if (res.status >= 400) {
              tally.refused += 1;
              expect(res.type, `${what}\n→ ${res.status} is not JSON`).toContain('application/json');
              const error = (JSON.parse(res.text) as { error?: unknown }).error;
              expect(typeof error === 'string' && error.length > 0, `${what}\n→ ${res.status} without an error message: ${res.text}`).toBe(true);
              const changed = changedTables(before, after).filter((t) => !COUNTED_WHEN_REFUSED.includes(t));
              expect(changed, `${what}\n→ ${res.status}, yet tables changed`).toEqual([]);
            } else {
              tally.ok += 1;
              cookies = {};
              // An accepted print job goes on writing its progress to its row after the answer; the next
              // request's before and after are taken once it has finished.
              await jobsSettled();
              state = await tableState(db);
              tally.accepted[route.route] = (tally.accepted[route.route] ?? 0) + 1;
              expect(await crossSeriesLeaks(db), `${what}\n→ ${res.status} tied two series together`).toEqual({});
            }
          }),
          // A failure prints its seed; SOAK_SEED=<seed> runs the same bodies again.
          { numRuns: RUNS, endOnFailure: !SOAK, seed: process.env.SOAK_SEED ? Number(process.env.SOAK_SEED) : undefined },
        );
      },
      SOAK ? 3_600_000 : 120_000,
    );
  }
});
