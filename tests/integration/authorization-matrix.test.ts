// Every route × every kind of caller, with the status each must get.
// Later routes join ROUTES. A refused call must leave the database unchanged.
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as gagRoute from '@/app/api/gags/[gagId]/route';
import * as healthRoute from '@/app/api/health/route';
import * as gagsRoute from '@/app/api/series/[seriesId]/gags/route';
import * as seriesRoute from '@/app/api/series/route';
import * as usersRoute from '@/app/api/users/route';
import * as passesRoute from '@/app/api/gags/[gagId]/passes/route';
import * as opsRoute from '@/app/api/passes/[passId]/ops/route';
import * as restoreRoute from '@/app/api/passes/[passId]/revisions/[revisionId]/restore/route';
import * as revisionsRoute from '@/app/api/passes/[passId]/revisions/route';
import * as passRoute from '@/app/api/passes/[passId]/route';
import * as thumbRoute from '@/app/api/passes/[passId]/thumbnail.svg/route';
import * as stampRoute from '@/app/api/passes/[passId]/stamp/route';
import * as activityRoute from '@/app/api/series/[seriesId]/activity/route';
import * as checklistRoute from '@/app/api/passes/[passId]/checklist/route';
import * as carryRoute from '@/app/api/passes/[passId]/checklist/carry/route';
import * as findingsRoute from '@/app/api/passes/[passId]/findings/route';
import * as itemsRoute from '@/app/api/series/[seriesId]/checklist/route';
import * as commentsRoute from '@/app/api/gags/[gagId]/comments/route';
import * as commentRoute from '@/app/api/comments/[commentId]/route';
import { createComment } from '@/db/queries/comments';
import * as invitationsRoute from '@/app/api/series/[seriesId]/invitations/route';
import * as invitationRoute from '@/app/api/series/[seriesId]/invitations/[invitationId]/route';
import * as resendRoute from '@/app/api/series/[seriesId]/invitations/[invitationId]/resend/route';
import * as membersRoute from '@/app/api/series/[seriesId]/members/route';
import * as memberRoute from '@/app/api/series/[seriesId]/members/[userId]/route';
import * as acceptRoute from '@/app/api/invitations/[token]/accept/route';
import * as meRoute from '@/app/api/me/route';
import { createInvitation } from '@/db/queries/members';
import * as stampsRoute from '@/app/api/gags/[gagId]/stamps/route';
import * as presenceRoute from '@/app/api/gags/[gagId]/presence/route';
import * as gagEventsRoute from '@/app/api/gags/[gagId]/events/route';
import * as passEventsRoute from '@/app/api/passes/[passId]/events/route';
import * as seriesEventsRoute from '@/app/api/series/[seriesId]/events/route';
import { createSeries } from '@/db/queries/series';
import * as volumesRoute from '@/app/api/series/[seriesId]/volumes/route';
import * as volumeRoute from '@/app/api/volumes/[volumeId]/route';
import * as entriesRoute from '@/app/api/volumes/[volumeId]/entries/route';
import * as entryRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/route';
import * as positionRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/position/route';
import * as flatplanRoute from '@/app/api/volumes/[volumeId]/flatplan/route';
import * as planRoute from '@/app/api/volumes/[volumeId]/plan/route';
import { addEntry, createVolume } from '@/db/queries/volumes';
import * as reviewPdfRoute from '@/app/api/volumes/[volumeId]/export/review.pdf/route';
import * as templatesPdfRoute from '@/app/api/volumes/[volumeId]/export/templates.pdf/route';
import * as templatesOfferRoute from '@/app/api/volumes/[volumeId]/export/templates/route';
import * as csvRoute from '@/app/api/volumes/[volumeId]/export/running-order.csv/route';
import * as specRoute from '@/app/api/series/[seriesId]/print-spec/route';
import { createGag } from '@/db/queries/gags';
import { createPass } from '@/db/queries/passes';
import { applyBatch } from '@/db/queries/batches';
import { checklistItems } from '@/db/queries/review';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import { callRoute } from '../support/call-route';
import { startMailFake } from '../support/mail-fake';
import { startS3Fake } from '../support/s3-fake';
import sharp from 'sharp';
import * as uploadsRoute from '@/app/api/series/[seriesId]/uploads/route';
import * as uploadRoute from '@/app/api/uploads/[uploadId]/route';
import * as variantRoute from '@/app/api/uploads/[uploadId]/[variant]/route';
import * as gagFinalPagesRoute from '@/app/api/gags/[gagId]/final-pages/route';
import * as entryFinalPagesRoute from '@/app/api/volumes/[volumeId]/entries/[entryId]/final-pages/route';
import * as finalCurrentRoute from '@/app/api/final-pages/[finalPageId]/current/route';
import * as finalFitRoute from '@/app/api/final-pages/[finalPageId]/fit/route';
import * as finalPreflightRoute from '@/app/api/final-pages/[finalPageId]/preflight/route';
import * as volumePreflightRoute from '@/app/api/volumes/[volumeId]/preflight/route';
import * as finalImageRoute from '@/app/api/final-pages/[finalPageId]/image/[variant]/route';
import * as printJobsRoute from '@/app/api/volumes/[volumeId]/print-jobs/route';
import * as printJobRoute from '@/app/api/print-jobs/[jobId]/route';
import * as printJobFileRoute from '@/app/api/print-jobs/[jobId]/file/route';
import * as printPdfRoute from '@/app/api/volumes/[volumeId]/export/print.pdf/route';
import * as coverPdfRoute from '@/app/api/volumes/[volumeId]/export/cover.pdf/route';
import { putObject } from '@/lib/storage/s3';
import { DEMO_SERIES_ID, type Persona, freshDb } from '../support/test-db';

const PERSONAS: Persona[] = ['anonymous', 'viewer', 'editor', 'cocreator', 'owner', 'outsider'];

let db: Awaited<ReturnType<typeof freshDb>>;
let mail: Awaited<ReturnType<typeof startMailFake>>;
let s3: Awaited<ReturnType<typeof startS3Fake>>;
beforeAll(async () => {
  mail = await startMailFake(); // invitations and stamps send mail; catch it
  s3 = await startS3Fake(); // uploads go to object storage
  db = await freshDb();
});
afterAll(async () => {
  await mail?.stop();
  await s3?.close();
});

let shade = 0;
/** A distinct small PNG each time (a new colour), as a multipart form. */
async function imageForm(): Promise<FormData> {
  shade += 1;
  const bytes = await sharp({ create: { width: 8, height: 8, channels: 3, background: { r: shade % 256, g: 100, b: Math.floor(shade / 256) } } })
    .png()
    .toBuffer();
  const form = new FormData();
  form.append('file', new File([new Uint8Array(bytes)], 'scan.png', { type: 'image/png' }));
  return form;
}

async function newUpload(): Promise<string> {
  const r = await callRoute(uploadsRoute.POST, { method: 'POST', as: 'owner', params: { seriesId: DEMO_SERIES_ID }, form: await imageForm() });
  return r.body.id;
}

/** An upload placed as the lightbox of a fresh pass. */
async function usedUpload(): Promise<string> {
  const uploadId = await newUpload();
  const { passId } = await newPass();
  const lightbox = { id: 'lb', uploadId, panel: null, x: 0, y: 0, w: 50, h: 50, rotation: 0 as const, opacity: 0.5, visible: true };
  await applyBatch(db, { passId, batchId: 'place', ops: [{ op: 'lightbox', lightbox }], userId: 'demo-user-owner', spec: DEFAULT_PAGE_SPEC });
  return uploadId;
}

async function newGag(): Promise<string> {
  const id = randomUUID();
  await createGag(db, { id, seriesId: DEMO_SERIES_ID, title: 'Matrix gag', premise: '' });
  return id;
}

/** A pass with one stroke and two revisions (created, then a pause), for pass routes. */
async function newPass(): Promise<{ passId: string; revisionId: string }> {
  const { id } = await createPass(db, { gagId: await newGag(), userId: 'demo-user-owner' });
  const stroke = {
    id: 'm1',
    panel: 0,
    tool: 'pen' as const,
    grey: 100,
    size: 1,
    points: [
      [10, 10, 0.5],
      [12, 12, 0.5],
    ] as [number, number, number][],
  };
  await applyBatch(db, { passId: id, batchId: 'seed', ops: [{ op: 'add', stroke }], userId: 'demo-user-owner', spec: DEFAULT_PAGE_SPEC });
  const rev = await db.selectFrom('revisions').select('id').where('passId', '=', id).where('seq', '=', 0).executeTakeFirstOrThrow();
  return { passId: id, revisionId: rev.id };
}

/** A gag with two final pages (small scans); the first, older one is no longer current. */
async function finalPages(): Promise<{ gagId: string; older: string; newer: string }> {
  const gagId = await newGag();
  const up = async () =>
    (await callRoute(gagFinalPagesRoute.POST, { method: 'POST', as: 'owner', params: { gagId }, form: await imageForm() })).body.id as string;
  const older = await up();
  return { gagId, older, newer: await up() };
}

/** A volume with a title page (a matter page). */
async function matterPage(): Promise<{ volumeId: string; entryId: string }> {
  const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Matter volume', deadline: '2027-03-13' });
  return { volumeId: v.id, entryId: (await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'title' })).id };
}

/** A volume of one blank page: it needs no scan, so its print file can be built at once. */
async function blankVolume(): Promise<string> {
  const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Blank volume', deadline: '2027-03-13' });
  await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'blank' });
  return v.id;
}

/** A finished print job with its file in storage. */
async function printJob(): Promise<string> {
  const id = randomUUID();
  const key = `test/print-jobs/${id}.pdf`;
  await putObject(key, Buffer.from('%PDF-1.7\n%%EOF\n'), 'application/pdf');
  const at = new Date().toISOString();
  await db
    .insertInto('printJobs')
    .values({
      id,
      volumeId: await blankVolume(),
      kind: 'print',
      state: 'done',
      objectKey: key,
      bytes: 15,
      pages: 1,
      requestedBy: 'demo-user-owner',
      createdAt: at,
      heartbeatAt: Date.now(),
      finishedAt: at,
    })
    .execute();
  return id;
}

/** A plain member of Kettle Crab to change or remove. */
async function newMember(): Promise<string> {
  const id = randomUUID();
  await db
    .insertInto('users')
    .values({ id, email: `${id}@pier.test`, name: 'Temp', passwordHash: 'x', createdAt: new Date().toISOString() })
    .execute();
  await db.insertInto('memberships').values({ seriesId: DEMO_SERIES_ID, userId: id, role: 'viewer', createdAt: new Date().toISOString() }).execute();
  return id;
}

/** An invitation to a series none of the personas belongs to, as a link anyone may use (addressed ones: auth.test.ts). */
async function newInvitationToken(): Promise<string> {
  const ownerId = await newMember();
  const { id } = await createSeries(db, { id: randomUUID(), title: 'Elsewhere', ownerId });
  const input = { seriesId: id, email: `${randomUUID()}@pier.test`, role: 'viewer' as const, invitedBy: ownerId, anyoneWithLink: true };
  return (await createInvitation(db, input)).token;
}

/** A pending invitation to Kettle Crab, for the owner to withdraw or send again. */
async function demoInvitation(): Promise<string> {
  const input = { seriesId: DEMO_SERIES_ID, email: `${randomUUID()}@pier.test`, role: 'viewer' as const, invitedBy: 'demo-user-owner' };
  return (await createInvitation(db, input)).id;
}

/** A volume with two gag pages. */
async function newVolume(): Promise<{ volumeId: string; entryIds: string[] }> {
  const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Matrix volume', deadline: '2027-03-13' });
  const a = await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: await newGag() });
  const b = await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: await newGag() });
  return { volumeId: v.id, entryIds: [a.id, b.id] };
}

type Prepared = { params?: Record<string, string>; body?: unknown; form?: FormData; url?: string };
type RouteCase = {
  route: string;
  handler: (req: Request, ctx: { params: Promise<any> }) => Promise<Response> | Response;
  method: string;
  prepare: () => Promise<Prepared>;
  expected: Record<Persona, number>;
};

//                    anonymous viewer editor cocreator owner outsider
const row = (a: number, v: number, e: number, c: number, o: number, x: number): Record<Persona, number> => ({
  anonymous: a,
  viewer: v,
  editor: e,
  cocreator: c,
  owner: o,
  outsider: x,
});

const ROUTES: RouteCase[] = [
  { route: 'GET /api/health', handler: healthRoute.GET, method: 'GET', prepare: async () => ({}), expected: row(200, 200, 200, 200, 200, 200) },
  {
    route: 'POST /api/users',
    handler: usersRoute.POST,
    method: 'POST',
    prepare: async () => ({ body: { name: 'New Person', email: `${randomUUID()}@pier.test`, password: 'long-enough-pw' } }),
    expected: row(201, 201, 201, 201, 201, 201),
  },
  { route: 'GET /api/series', handler: seriesRoute.GET, method: 'GET', prepare: async () => ({}), expected: row(401, 200, 200, 200, 200, 200) },
  {
    route: 'POST /api/series',
    handler: seriesRoute.POST,
    method: 'POST',
    prepare: async () => ({ body: { title: 'A new series' } }),
    expected: row(401, 201, 201, 201, 201, 201),
  },
  {
    route: 'GET /api/series/:seriesId/gags',
    handler: gagsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/series/:seriesId/gags',
    handler: gagsRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID }, body: { title: 'Crab Cakes' } }),
    expected: row(401, 403, 403, 201, 201, 404),
  },
  {
    route: 'GET /api/gags/:gagId',
    handler: gagRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { gagId: await newGag() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'PATCH /api/gags/:gagId',
    handler: gagRoute.PATCH,
    method: 'PATCH',
    prepare: async () => ({ params: { gagId: await newGag() }, body: { title: 'Changed', beats: [{ kind: 'turn', note: 'A wave.' }] } }),
    expected: row(401, 403, 403, 200, 200, 404),
  },
  {
    route: 'DELETE /api/gags/:gagId',
    handler: gagRoute.DELETE,
    method: 'DELETE',
    prepare: async () => ({ params: { gagId: await newGag() } }),
    expected: row(401, 403, 403, 403, 204, 404),
  },
  {
    route: 'GET /api/series/:seriesId/print-spec',
    handler: specRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'PUT /api/series/:seriesId/print-spec',
    handler: specRoute.PUT,
    method: 'PUT',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID }, body: { ...DEFAULT_PAGE_SPEC, gutter: 3 + Math.random() } }),
    expected: row(401, 403, 403, 403, 200, 404),
  },
  {
    route: 'GET /api/gags/:gagId/passes',
    handler: passesRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { gagId: await newGag() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/gags/:gagId/passes',
    handler: passesRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { gagId: await newGag() }, body: {} }),
    expected: row(401, 403, 403, 201, 201, 404),
  },
  {
    route: 'GET /api/passes/:passId',
    handler: passRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { passId: (await newPass()).passId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/passes/:passId/stamp',
    handler: stampRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { passId: (await newPass()).passId }, body: { decision: 'ready', note: 'Reads.' } }),
    expected: row(401, 403, 201, 403, 201, 404),
  },
  {
    route: 'GET /api/passes/:passId/checklist',
    handler: checklistRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { passId: (await newPass()).passId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'PUT /api/passes/:passId/checklist',
    handler: checklistRoute.PUT,
    method: 'PUT',
    prepare: async () => {
      const { passId } = await newPass();
      const [item] = await checklistItems(db, DEMO_SERIES_ID);
      return { params: { passId }, body: { ticked: [item!.id] } };
    },
    expected: row(401, 403, 200, 200, 200, 404),
  },
  {
    // The ticks of the pass before, carried as "to re-check".
    route: 'POST /api/passes/:passId/checklist/carry',
    handler: carryRoute.POST,
    method: 'POST',
    prepare: async () => {
      const { passId } = await newPass();
      const [item] = await checklistItems(db, DEMO_SERIES_ID);
      const gagId = (await db.selectFrom('passes').select('gagId').where('id', '=', passId).executeTakeFirstOrThrow()).gagId;
      await db
        .insertInto('checklistTicks')
        .values({ passId, itemId: item!.id, userId: 'demo-user-editor', tickedAt: new Date().toISOString() })
        .execute();
      const next = await createPass(db, { gagId, userId: 'demo-user-owner' });
      return { params: { passId: next.id }, body: {} };
    },
    expected: row(401, 403, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/passes/:passId/findings',
    handler: findingsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { passId: (await newPass()).passId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/series/:seriesId/checklist',
    handler: itemsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'PUT /api/series/:seriesId/checklist',
    handler: itemsRoute.PUT,
    method: 'PUT',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID }, body: { items: [{ text: `Reads without words ${randomUUID()}` }] } }),
    expected: row(401, 403, 403, 403, 200, 404),
  },
  {
    route: 'GET /api/gags/:gagId/comments',
    handler: commentsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { gagId: await newGag() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/gags/:gagId/comments',
    handler: commentsRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { gagId: await newGag() }, body: { body: 'Panel 3 reads late.' } }),
    expected: row(401, 403, 201, 201, 201, 404),
  },
  {
    // Resolving a thread: anyone who may comment (editing the body is the author's alone).
    route: 'PATCH /api/comments/:commentId',
    handler: commentRoute.PATCH,
    method: 'PATCH',
    prepare: async () => {
      const gagId = await newGag();
      const c = await createComment(db, { gagId, seriesId: DEMO_SERIES_ID, authorId: 'demo-user-editor', body: 'Hm.', target: 'gag' });
      return { params: { commentId: c.id }, body: { resolved: true } };
    },
    expected: row(401, 403, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/series/:seriesId/members',
    handler: membersRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'PATCH /api/series/:seriesId/members/:userId',
    handler: memberRoute.PATCH,
    method: 'PATCH',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID, userId: await newMember() }, body: { role: 'editor' } }),
    expected: row(401, 403, 403, 403, 200, 404),
  },
  {
    route: 'DELETE /api/series/:seriesId/members/:userId',
    handler: memberRoute.DELETE,
    method: 'DELETE',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID, userId: await newMember() } }),
    expected: row(401, 403, 403, 403, 204, 404),
  },
  {
    route: 'GET /api/series/:seriesId/invitations',
    handler: invitationsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 403, 403, 403, 200, 404),
  },
  {
    route: 'POST /api/series/:seriesId/invitations',
    handler: invitationsRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID }, body: { email: `${randomUUID()}@pier.test`, role: 'viewer' } }),
    expected: row(401, 403, 403, 403, 201, 404),
  },
  {
    route: 'DELETE /api/series/:seriesId/invitations/:invitationId',
    handler: invitationRoute.DELETE,
    method: 'DELETE',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID, invitationId: await demoInvitation() } }),
    expected: row(401, 403, 403, 403, 204, 404),
  },
  {
    route: 'POST /api/series/:seriesId/invitations/:invitationId/resend',
    handler: resendRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID, invitationId: await demoInvitation() } }),
    expected: row(401, 403, 403, 403, 201, 404),
  },
  {
    route: 'POST /api/invitations/:token/accept',
    handler: acceptRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { token: await newInvitationToken() } }),
    expected: row(401, 200, 200, 200, 200, 200),
  },
  {
    route: 'GET /api/gags/:gagId/stamps',
    handler: stampsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { gagId: await newGag() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/gags/:gagId/presence',
    handler: presenceRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { gagId: await newGag() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/gags/:gagId/presence',
    handler: presenceRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { gagId: await newGag() }, body: { where: 'pass:1' } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/gags/:gagId/events',
    handler: gagEventsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { gagId: await newGag() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/passes/:passId/events',
    handler: passEventsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { passId: (await newPass()).passId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/series/:seriesId/events',
    handler: seriesEventsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/series/:seriesId/volumes',
    handler: volumesRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/series/:seriesId/volumes',
    handler: volumesRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID }, body: { title: 'Spring Tide', deadline: '2027-06-01' } }),
    expected: row(401, 403, 403, 403, 201, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId',
    handler: volumeRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'PATCH /api/volumes/:volumeId',
    handler: volumeRoute.PATCH,
    method: 'PATCH',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId }, body: { spec: { binding: 'perfect' } } }),
    expected: row(401, 403, 403, 403, 200, 404),
  },
  {
    route: 'POST /api/volumes/:volumeId/entries',
    handler: entriesRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId }, body: { kind: 'blank' } }),
    expected: row(401, 403, 403, 201, 201, 404),
  },
  {
    route: 'DELETE /api/volumes/:volumeId/entries/:entryId',
    handler: entryRoute.DELETE,
    method: 'DELETE',
    prepare: async () => {
      const v = await newVolume();
      return { params: { volumeId: v.volumeId, entryId: v.entryIds[0]! } };
    },
    expected: row(401, 403, 403, 204, 204, 404),
  },
  {
    route: 'PATCH /api/volumes/:volumeId/entries/:entryId',
    handler: entryRoute.PATCH,
    method: 'PATCH',
    prepare: async () => {
      const v = await newVolume();
      const cover = await addEntry(db, v.volumeId, DEMO_SERIES_ID, { kind: 'cover' });
      return { params: { volumeId: v.volumeId, entryId: cover.id }, body: { done: true } };
    },
    expected: row(401, 403, 403, 200, 200, 404),
  },
  {
    route: 'PUT /api/volumes/:volumeId/entries/:entryId/position',
    handler: positionRoute.PUT,
    method: 'PUT',
    prepare: async () => {
      const v = await newVolume();
      return { params: { volumeId: v.volumeId, entryId: v.entryIds[1]! }, body: { before: v.entryIds[0] } };
    },
    expected: row(401, 403, 403, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/flatplan',
    handler: flatplanRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/plan',
    handler: planRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/export/review.pdf',
    handler: reviewPdfRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/export/review.pdf?lightbox=1',
    handler: reviewPdfRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId }, url: '/?lightbox=1' }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/export/templates.pdf',
    handler: templatesPdfRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/export/templates',
    handler: templatesOfferRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/export/running-order.csv',
    handler: csvRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/series/:seriesId/uploads',
    handler: uploadsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/series/:seriesId/uploads',
    handler: uploadsRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID }, form: await imageForm() }),
    expected: row(401, 403, 403, 201, 201, 404),
  },
  {
    route: 'GET /api/uploads/:uploadId/:variant',
    handler: variantRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { uploadId: await newUpload(), variant: 'preview' } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'DELETE /api/uploads/:uploadId',
    handler: uploadRoute.DELETE,
    method: 'DELETE',
    prepare: async () => ({ params: { uploadId: await newUpload() } }),
    expected: row(401, 403, 403, 204, 204, 404),
  },
  {
    // Still a pass's lightbox: asks first (409, nothing deleted)…
    route: 'DELETE /api/uploads/:uploadId (in use)',
    handler: uploadRoute.DELETE,
    method: 'DELETE',
    prepare: async () => ({ params: { uploadId: await usedUpload() } }),
    expected: row(401, 403, 403, 409, 409, 404),
  },
  {
    // …and deletes once confirmed.
    route: 'DELETE /api/uploads/:uploadId?confirm=1 (in use)',
    handler: uploadRoute.DELETE,
    method: 'DELETE',
    prepare: async () => ({ params: { uploadId: await usedUpload() }, url: '/?confirm=1' }),
    expected: row(401, 403, 403, 204, 204, 404),
  },
  {
    route: 'GET /api/gags/:gagId/final-pages',
    handler: gagFinalPagesRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { gagId: (await finalPages()).gagId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/gags/:gagId/final-pages',
    handler: gagFinalPagesRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { gagId: await newGag() }, form: await imageForm() }),
    expected: row(401, 403, 403, 201, 201, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/entries/:entryId/final-pages',
    handler: entryFinalPagesRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: await matterPage() }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/volumes/:volumeId/entries/:entryId/final-pages',
    handler: entryFinalPagesRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: await matterPage(), form: await imageForm() }),
    expected: row(401, 403, 403, 201, 201, 404),
  },
  {
    route: 'POST /api/final-pages/:finalPageId/current',
    handler: finalCurrentRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { finalPageId: (await finalPages()).older } }),
    expected: row(401, 403, 403, 200, 200, 404),
  },
  {
    route: 'PUT /api/final-pages/:finalPageId/fit',
    handler: finalFitRoute.PUT,
    method: 'PUT',
    prepare: async () => ({ params: { finalPageId: (await finalPages()).newer }, body: { to: 'bleed', x: 1, y: 0, scale: 1, rotation: 90 } }),
    expected: row(401, 403, 403, 200, 200, 404),
  },
  {
    route: 'GET /api/final-pages/:finalPageId/preflight',
    handler: finalPreflightRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { finalPageId: (await finalPages()).newer } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/preflight',
    handler: volumePreflightRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: (await newVolume()).volumeId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/final-pages/:finalPageId/image/:variant',
    handler: finalImageRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { finalPageId: (await finalPages()).newer, variant: 'kept' } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/print-jobs',
    handler: printJobsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: await blankVolume() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/volumes/:volumeId/print-jobs',
    handler: printJobsRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { volumeId: await blankVolume() }, body: { kind: 'print' } }),
    expected: row(401, 403, 202, 202, 202, 404),
  },
  {
    // A proof is the owner's to ask for.
    route: 'POST /api/volumes/:volumeId/print-jobs (proof)',
    handler: printJobsRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { volumeId: await blankVolume() }, body: { kind: 'print', proof: true } }),
    expected: row(401, 403, 403, 403, 202, 404),
  },
  {
    route: 'GET /api/print-jobs/:jobId',
    handler: printJobRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { jobId: await printJob() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/print-jobs/:jobId/file',
    handler: printJobFileRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { jobId: await printJob() } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/volumes/:volumeId/export/print.pdf',
    handler: printPdfRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: await blankVolume() } }),
    expected: row(401, 403, 200, 200, 200, 404),
  },
  {
    // A saddle-stitched book has no cover file (after the role check).
    route: 'GET /api/volumes/:volumeId/export/cover.pdf',
    handler: coverPdfRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { volumeId: await blankVolume() } }),
    expected: row(401, 403, 422, 422, 422, 404),
  },
  { route: 'GET /api/me', handler: meRoute.GET, method: 'GET', prepare: async () => ({}), expected: row(401, 200, 200, 200, 200, 200) },
  {
    route: 'PATCH /api/me',
    handler: meRoute.PATCH,
    method: 'PATCH',
    // Each person starts with notifications on, and each is asked once: turning them off is a change.
    prepare: async () => ({ body: { notifyEmail: false } }),
    expected: row(401, 200, 200, 200, 200, 200),
  },
  {
    route: 'GET /api/series/:seriesId/activity',
    handler: activityRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { seriesId: DEMO_SERIES_ID } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'GET /api/passes/:passId/thumbnail.svg',
    handler: thumbRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { passId: (await newPass()).passId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/passes/:passId/ops',
    handler: opsRoute.POST,
    method: 'POST',
    prepare: async () => ({ params: { passId: (await newPass()).passId }, body: { batchId: randomUUID(), ops: [{ op: 'remove', strokeId: 'm1' }] } }),
    expected: row(401, 403, 403, 200, 200, 404),
  },
  {
    route: 'POST /api/passes/:passId/ops (lightbox)',
    handler: opsRoute.POST,
    method: 'POST',
    prepare: async () => {
      const lightbox = { id: 'lb', uploadId: await newUpload(), panel: 1, x: 80, y: 10, w: 50, h: 50, rotation: 90, opacity: 0.4, visible: true };
      return { params: { passId: (await newPass()).passId }, body: { batchId: randomUUID(), ops: [{ op: 'lightbox', lightbox }] } };
    },
    expected: row(401, 403, 403, 200, 200, 404),
  },
  {
    route: 'GET /api/passes/:passId/revisions',
    handler: revisionsRoute.GET,
    method: 'GET',
    prepare: async () => ({ params: { passId: (await newPass()).passId } }),
    expected: row(401, 200, 200, 200, 200, 404),
  },
  {
    route: 'POST /api/passes/:passId/revisions/:revisionId/restore',
    handler: restoreRoute.POST,
    method: 'POST',
    prepare: async () => {
      const p = await newPass();
      return { params: { passId: p.passId, revisionId: p.revisionId } };
    },
    expected: row(401, 403, 403, 200, 200, 404),
  },
];

async function snapshot() {
  return JSON.stringify({
    users: await db.selectFrom('users').select(['id', 'email', 'name']).orderBy('id').execute(),
    series: await db.selectFrom('series').selectAll().orderBy('id').execute(),
    memberships: await db.selectFrom('memberships').selectAll().orderBy('seriesId').orderBy('userId').execute(),
    gags: await db.selectFrom('gags').selectAll().orderBy('id').execute(),
    beats: await db.selectFrom('beats').selectAll().orderBy('gagId').orderBy('kind').execute(),
    passes: await db.selectFrom('passes').selectAll().orderBy('id').execute(),
    strokes: await db.selectFrom('strokes').select(['rowId', 'passId', 'strokeId', 'ox', 'oy', 'addedSeq', 'removedSeq']).orderBy('rowId').execute(),
    revisions: await db.selectFrom('revisions').selectAll().orderBy('id').execute(),
    stamps: await db.selectFrom('stamps').selectAll().orderBy('id').execute(),
    ticks: await db.selectFrom('checklistTicks').selectAll().orderBy('passId').orderBy('itemId').execute(),
    rechecks: await db.selectFrom('checklistRechecks').selectAll().orderBy('passId').orderBy('itemId').execute(),
    items: await db.selectFrom('checklistItems').selectAll().orderBy('id').execute(),
    comments: await db.selectFrom('comments').selectAll().orderBy('id').execute(),
    invitations: await db.selectFrom('invitations').selectAll().orderBy('id').execute(),
    notify: await db.selectFrom('users').select(['id', 'notifyEmail']).orderBy('id').execute(),
    presence: await db.selectFrom('presenceTabs').selectAll().orderBy('tabId').orderBy('userId').execute(),
    volumes: await db.selectFrom('volumes').selectAll().orderBy('id').execute(),
    entries: await db.selectFrom('volumeEntries').selectAll().orderBy('id').execute(),
    uploads: await db.selectFrom('uploads').select(['id', 'sha256']).orderBy('id').execute(),
    finalPages: await db.selectFrom('finalPages').select(['id', 'current', 'madeCurrentAt', 'fittedAt', 'fitX']).orderBy('id').execute(),
    lightboxes: await db.selectFrom('lightboxes').select(['rowId', 'passId', 'lightboxId', 'removedSeq']).orderBy('rowId').execute(),
    printJobs: await db.selectFrom('printJobs').select(['id', 'volumeId', 'kind', 'proof']).orderBy('id').execute(),
  });
}

/** Every route handler in app/api as "METHOD /api/path/:param", read from the files themselves. */
function declaredRoutes(): string[] {
  const root = path.resolve(import.meta.dirname, '../../app/api');
  const found: string[] = [];
  const walk = (dir: string) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === 'route.ts') {
        const url =
          '/api/' +
          path
            .relative(root, dir)
            .split(path.sep)
            .map((seg) => seg.replace(/^\[(.+)\]$/, ':$1'))
            .join('/');
        for (const m of fs.readFileSync(full, 'utf8').matchAll(/export (?:const|async function) (GET|POST|PUT|PATCH|DELETE)\b/g))
          found.push(`${m[1]} ${url}`);
      }
    }
  };
  walk(root);
  return found.sort();
}

// next-auth's own endpoints (sign-in, CSRF, session) are public by design and tested through the sign-in flows.
const NOT_IN_MATRIX = ['GET /api/auth/:...nextauth', 'POST /api/auth/:...nextauth'];

describe('the matrix covers every route', () => {
  it('lists each method of each route handler in app/api, and nothing that does not exist', () => {
    const declared = declaredRoutes().filter((r) => !NOT_IN_MATRIX.includes(r));
    const listed = [...new Set(ROUTES.map((r) => r.route.split(' ').slice(0, 2).join(' ').split('?')[0]!))].sort();
    expect(
      declared.filter((r) => !listed.includes(r)),
      'routes missing from the matrix',
    ).toEqual([]);
    expect(
      listed.filter((r) => !declared.includes(r)),
      'matrix rows for routes that do not exist',
    ).toEqual([]);
  });
});

describe('authorization matrix', () => {
  for (const r of ROUTES) {
    describe(r.route, () => {
      it.each(PERSONAS)(`%s`, async (persona) => {
        const { params, body, form, url } = await r.prepare();
        const before = await snapshot();
        const res = await callRoute(r.handler, { method: r.method, as: persona, params, body, form, url });
        expect(res.status).toBe(r.expected[persona]);
        if (res.status >= 400) {
          expect(typeof res.body.error).toBe('string');
          expect(await snapshot()).toEqual(before);
        } else if (r.method !== 'GET') {
          expect(await snapshot()).not.toEqual(before);
        }
      });
    });
  }
});
