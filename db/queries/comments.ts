// Comment threads on a gag, pinned to the gag, a pass, a panel of a pass, a beat,
// or a point in a panel (mm). Replies take their thread's pin.
import { randomUUID } from 'node:crypto';
import type { Kysely, Selectable } from 'kysely';
import type { BeatKind } from '@/lib/gags/status';
import { type Mentions, findMentions } from '@/lib/review/mentions';
import type { CommentTarget, CommentsTable, Database } from '../database';
import { recordActivity } from './activity';
import { Refused } from '@/lib/refused';
import { keptQuery } from '../kept-query';

/** A comment row as the API shows it, with its pass's number and its author's name. */
export type CommentDto = Selectable<CommentsTable> & { passNumber: number | null; author: string };
export type ThreadDto = CommentDto & { replies: CommentDto[] };

function baseQuery(db: Kysely<Database>) {
  return db
    .selectFrom('comments as c')
    .innerJoin('users as u', 'u.id', 'c.authorId')
    .leftJoin('passes as p', 'p.id', 'c.passId')
    .leftJoin('users as r', 'r.id', 'c.resolvedBy')
    .select([
      'c.id',
      'c.gagId',
      'c.parentId',
      'c.target',
      'c.passId',
      'p.number as passNumber',
      'c.panel',
      'c.beat',
      'c.x',
      'c.y',
      'c.body',
      'c.authorId',
      'u.name as author',
      'c.createdAt',
      'c.editedAt',
      'c.resolvedAt',
      'r.name as resolvedBy',
    ]);
}

export async function findComment(db: Kysely<Database>, id: string): Promise<CommentDto | undefined> {
  return baseQuery(db).where('c.id', '=', id).executeTakeFirst();
}

const commentSeries = keptQuery((db, id: string) =>
  db.selectFrom('comments as c').innerJoin('gags as g', 'g.id', 'c.gagId').select('g.seriesId').where('c.id', '=', id),
);

export async function seriesOfComment(db: Kysely<Database>, id: string): Promise<string | null> {
  const [row] = await commentSeries(db, id);
  return row?.seriesId ?? null;
}

export async function listThreads(db: Kysely<Database>, gagId: string): Promise<ThreadDto[]> {
  const all = await baseQuery(db).where('c.gagId', '=', gagId).orderBy('c.createdAt').execute();
  const threads = new Map<string, ThreadDto>();
  for (const c of all) if (!c.parentId) threads.set(c.id, { ...c, replies: [] });
  for (const c of all) if (c.parentId) threads.get(c.parentId)?.replies.push(c);
  return [...threads.values()];
}

/** The "@" mentions of a text, resolved against the series' members (lib/review/mentions: the form reads them the same way). */
export async function mentionsIn(db: Kysely<Database>, seriesId: string, body: string): Promise<Mentions> {
  const members = await db
    .selectFrom('memberships as m')
    .innerJoin('users as u', 'u.id', 'm.userId')
    .select(['u.id as userId', 'u.name', 'u.email'])
    .where('m.seriesId', '=', seriesId)
    .orderBy('m.createdAt')
    .execute();
  return findMentions(body, members);
}

export async function createComment(
  db: Kysely<Database>,
  input: {
    gagId: string;
    seriesId: string;
    authorId: string;
    body: string;
    parentId?: string;
    target: CommentTarget;
    passId?: string;
    panel?: number;
    beat?: BeatKind;
    x?: number;
    y?: number;
  },
): Promise<CommentDto> {
  const id = randomUUID();
  await db.transaction().execute(async (trx) => {
    let pin = {
      target: input.target,
      passId: input.passId ?? null,
      panel: input.panel ?? null,
      beat: input.beat ?? null,
      x: input.x ?? null,
      y: input.y ?? null,
    };
    if (input.parentId) {
      const parent = await trx.selectFrom('comments').selectAll().where('id', '=', input.parentId).executeTakeFirst();
      if (!parent || parent.gagId !== input.gagId) throw new Refused(422, 'The thread you reply to is not on this gag.');
      if (parent.parentId) throw new Refused(422, 'Reply to the thread, not to a reply.');
      pin = { target: parent.target, passId: parent.passId, panel: parent.panel, beat: parent.beat, x: parent.x, y: parent.y };
    } else if (pin.passId) {
      const pass = await trx.selectFrom('passes').select('gagId').where('id', '=', pin.passId).executeTakeFirst();
      if (!pass || pass.gagId !== input.gagId) throw new Refused(422, 'That pass is not one of this gag’s passes.');
    }
    if (pin.target === 'gag' || pin.target === 'beat') pin = { ...pin, passId: null, panel: null, x: null, y: null };
    await trx
      .insertInto('comments')
      .values({
        id,
        gagId: input.gagId,
        parentId: input.parentId ?? null,
        ...pin,
        body: input.body,
        authorId: input.authorId,
        createdAt: new Date().toISOString(),
        editedAt: null,
        resolvedAt: null,
        resolvedBy: null,
      })
      .execute();
    const gag = await trx.selectFrom('gags').select('title').where('id', '=', input.gagId).executeTakeFirstOrThrow();
    await recordActivity(trx, {
      seriesId: input.seriesId,
      gagId: input.gagId,
      passId: pin.passId,
      userId: input.authorId,
      kind: 'comment.created',
      summary: `${input.parentId ? 'replied on' : 'commented on'} “${gag.title}”`,
    });
  });
  return (await findComment(db, id))!;
}

export async function updateComment(db: Kysely<Database>, id: string, patch: { body?: string; resolved?: boolean }, userId: string) {
  const now = new Date().toISOString();
  await db
    .updateTable('comments')
    .set({
      ...(patch.body !== undefined ? { body: patch.body, editedAt: now } : {}),
      ...(patch.resolved === true ? { resolvedAt: now, resolvedBy: userId } : {}),
      ...(patch.resolved === false ? { resolvedAt: null, resolvedBy: null } : {}),
    })
    .where('id', '=', id)
    .execute();
  return (await findComment(db, id))!;
}
