// The series' activity feed: one row per event worth telling the team.
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '../database';

type Db = Kysely<Database> | Transaction<Database>;

export type ActivityKind =
  | 'gag.created'
  | 'gag.deleted'
  | 'gag.moved'
  | 'pass.created'
  | 'pass.restored'
  | 'stamp.ready'
  | 'stamp.again'
  | 'stamp.cleared'
  | 'comment.created'
  | 'member.joined'
  | 'final.uploaded';

export async function recordActivity(
  db: Db,
  e: { seriesId: string; gagId?: string | null; passId?: string | null; userId: string | null; kind: ActivityKind; summary: string },
): Promise<void> {
  await db
    .insertInto('activity')
    .values({
      seriesId: e.seriesId,
      gagId: e.gagId ?? null,
      passId: e.passId ?? null,
      userId: e.userId,
      kind: e.kind,
      summary: e.summary,
      createdAt: new Date().toISOString(),
    })
    .execute();
}

export type ActivityDto = {
  id: number;
  kind: string;
  summary: string;
  gagId: string | null;
  passId: string | null;
  by: string | null;
  createdAt: string;
};

/** Newest first; pass the last id seen as `before` for the next page. */
export async function listActivity(db: Db, seriesId: string, opts: { before?: number; limit?: number } = {}) {
  const limit = Math.min(100, Math.max(1, opts.limit ?? 20));
  let q = db
    .selectFrom('activity as a')
    .leftJoin('users as u', 'u.id', 'a.userId')
    .select(['a.id', 'a.kind', 'a.summary', 'a.gagId', 'a.passId', 'u.name as by', 'a.createdAt'])
    .where('a.seriesId', '=', seriesId)
    .orderBy('a.id', 'desc')
    .limit(limit + 1);
  if (opts.before !== undefined) q = q.where('a.id', '<', opts.before);
  const rows = await q.execute();
  const items: ActivityDto[] = rows.slice(0, limit);
  return { items, nextBefore: rows.length > limit ? items[items.length - 1]!.id : null };
}
