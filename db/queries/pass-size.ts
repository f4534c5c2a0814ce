// How much a pass holds (live strokes and their points), kept on its row so the
// size limit is checked in O(1) on every batch. Batches adjust it by what they
// actually added and removed; the rare whole-pass rewrites (a copy, a restore,
// the demo seed) count it again from the rows.
import { type Kysely, type Transaction, sql } from 'kysely';
import { Refused } from '@/lib/refused';
import { MAX_PASS_POINTS, MAX_PASS_STROKES } from '@/lib/strokes/types';
import type { Database } from '../database';

type Db = Kysely<Database> | Transaction<Database>;

export type SizeChange = { strokes: number; points: number };

/** Counts the pass's live strokes and points from its rows and stores them. */
export async function recountPass(db: Db, passId: string): Promise<void> {
  await db
    .updateTable('passes')
    .set({
      liveStrokes: sql<number>`(select count(*) from strokes where strokes.pass_id = passes.id and strokes.removed_seq is null)`,
      livePoints: sql<number>`(select coalesce(sum(point_count), 0) from strokes where strokes.pass_id = passes.id and strokes.removed_seq is null)`,
    })
    .where('id', '=', passId)
    .execute();
}

/** The size a batch leaves, refused whole (nothing of it kept) when it passes the limit while adding. */
export function sizeAfter(before: { liveStrokes: number; livePoints: number }, change: SizeChange, adds: boolean): SizeChange {
  const after = { strokes: Number(before.liveStrokes) + change.strokes, points: Number(before.livePoints) + change.points };
  if (adds && (after.strokes > MAX_PASS_STROKES || after.points > MAX_PASS_POINTS)) {
    throw new Refused(
      422,
      `A pass holds at most ${MAX_PASS_STROKES.toLocaleString('en')} strokes and ${MAX_PASS_POINTS.toLocaleString('en')} points; this one is full. Start a new pass, or erase some strokes first.`,
    );
  }
  return after;
}
