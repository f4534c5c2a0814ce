// Clean text (issue 13, found 8; OWASP ASVS 4.0 V5.1.4): every free-text field that is stored refuses NUL,
// other control characters and lone UTF-16 surrogates with 422, and stores nothing. (A lone surrogate is
// half a character and cannot be written as UTF-8; PostgreSQL refuses NUL in text outright.)
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import * as commentRoute from '@/app/api/comments/[commentId]/route';
import * as commentsRoute from '@/app/api/gags/[gagId]/comments/route';
import * as gagRoute from '@/app/api/gags/[gagId]/route';
import * as stampRoute from '@/app/api/passes/[passId]/stamp/route';
import * as itemsRoute from '@/app/api/series/[seriesId]/checklist/route';
import * as gagsRoute from '@/app/api/series/[seriesId]/gags/route';
import * as volumesRoute from '@/app/api/series/[seriesId]/volumes/route';
import * as seriesRoute from '@/app/api/series/route';
import * as usersRoute from '@/app/api/users/route';
import * as volumeRoute from '@/app/api/volumes/[volumeId]/route';
import { createComment } from '@/db/queries/comments';
import { createGag } from '@/db/queries/gags';
import { createPass } from '@/db/queries/passes';
import { createVolume } from '@/db/queries/volumes';
import { callRoute } from '../../support/call-route';
import { changedTables, tableState } from '../../support/table-state';
import { DEMO_SERIES_ID, freshDb } from '../../support/test-db';

const DIRTY = { NUL: 'Crab\u0000Cakes', 'a lone surrogate': 'Crab\ud800Cakes', 'a control character': 'Crab\u0007Cakes' };

let db: Awaited<ReturnType<typeof freshDb>>;
const ids = { gagId: '', passId: '', commentId: '', volumeId: '' };

beforeAll(async () => {
  db = await freshDb();
  ids.gagId = randomUUID();
  await createGag(db, { id: ids.gagId, seriesId: DEMO_SERIES_ID, title: 'Clean text', premise: '' });
  ids.passId = (await createPass(db, { gagId: ids.gagId, userId: 'demo-user-owner' })).id;
  ids.commentId = (
    await createComment(db, { gagId: ids.gagId, seriesId: DEMO_SERIES_ID, authorId: 'demo-user-owner', body: 'Hm.', target: 'gag' })
  ).id;
  ids.volumeId = (await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Clean', deadline: '2027-03-13' })).id;
});

type Field = {
  field: string;
  handler: (req: Request, ctx: { params: Promise<any> }) => Promise<Response>;
  method: string;
  params: () => Record<string, string>;
  body: (text: string) => unknown;
};

const FIELDS: Field[] = [
  { field: 'series title', handler: seriesRoute.POST, method: 'POST', params: () => ({}), body: (t) => ({ title: t }) },
  { field: 'gag title', handler: gagsRoute.POST, method: 'POST', params: () => ({ seriesId: DEMO_SERIES_ID }), body: (t) => ({ title: t }) },
  {
    field: 'gag premise',
    handler: gagsRoute.POST,
    method: 'POST',
    params: () => ({ seriesId: DEMO_SERIES_ID }),
    body: (t) => ({ title: 'Fine', premise: t }),
  },
  { field: 'gag title (edit)', handler: gagRoute.PATCH, method: 'PATCH', params: () => ({ gagId: ids.gagId }), body: (t) => ({ title: t }) },
  {
    field: 'beat note',
    handler: gagRoute.PATCH,
    method: 'PATCH',
    params: () => ({ gagId: ids.gagId }),
    body: (t) => ({ beats: [{ kind: 'setup', note: t }] }),
  },
  { field: 'comment', handler: commentsRoute.POST, method: 'POST', params: () => ({ gagId: ids.gagId }), body: (t) => ({ body: t }) },
  { field: 'comment (edit)', handler: commentRoute.PATCH, method: 'PATCH', params: () => ({ commentId: ids.commentId }), body: (t) => ({ body: t }) },
  {
    field: 'checklist item',
    handler: itemsRoute.PUT,
    method: 'PUT',
    params: () => ({ seriesId: DEMO_SERIES_ID }),
    body: (t) => ({ items: [{ text: t }] }),
  },
  {
    field: 'stamp note',
    handler: stampRoute.POST,
    method: 'POST',
    params: () => ({ passId: ids.passId }),
    body: (t) => ({ decision: 'again', note: t }),
  },
  {
    field: 'volume title',
    handler: volumesRoute.POST,
    method: 'POST',
    params: () => ({ seriesId: DEMO_SERIES_ID }),
    body: (t) => ({ title: t, deadline: '2027-06-01' }),
  },
  {
    field: 'volume title (edit)',
    handler: volumeRoute.PATCH,
    method: 'PATCH',
    params: () => ({ volumeId: ids.volumeId }),
    body: (t) => ({ title: t }),
  },
  {
    field: 'account name',
    handler: usersRoute.POST,
    method: 'POST',
    params: () => ({}),
    body: (t) => ({ name: t, email: `${randomUUID()}@pier.test`, password: `Low tide at the pier ${randomUUID()}` }),
  },
];

describe('free text refuses what is not text', () => {
  for (const f of FIELDS) {
    it.each(Object.entries(DIRTY))(`${f.field} with %s: 422, nothing stored`, async (_what, text) => {
      const before = await tableState(db);
      const res = await callRoute(f.handler, { method: f.method, as: 'owner', params: f.params(), body: f.body(text) });
      expect(res.status, JSON.stringify(res.body)).toBe(422);
      expect(typeof res.body.error).toBe('string');
      expect(changedTables(before, await tableState(db))).toEqual([]);
    });
  }
});
