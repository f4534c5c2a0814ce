// How a stroke is kept in a row (quantised, delta-encoded points; bounds; a move
// offset) and read back, and the strokes of a pass as they stood at a given seq.
// Shared by the pass log and by restoring a revision.
import type { Kysely, Transaction } from 'kysely';
import { decodePoints, encodePoints } from '@/lib/strokes/codec';
import { pointsBounds } from '@/lib/strokes/hit';
import { type Stroke, translatePoints } from '@/lib/strokes/types';
import type { Database } from '../database';

type Db = Kysely<Database> | Transaction<Database>;

export function rowToStroke(
  row: { strokeId: string; panel: number; tool: Stroke['tool']; grey: number; size: number; points: Buffer | Uint8Array },
  ox: number,
  oy: number,
): Stroke {
  return {
    id: row.strokeId,
    panel: row.panel,
    tool: row.tool,
    grey: row.grey,
    size: row.size,
    points: translatePoints(decodePoints(row.points instanceof Uint8Array ? row.points : new Uint8Array(row.points)), ox, oy),
  };
}

export function strokeRowValues(passId: string, stroke: Stroke, seq: number, userId: string | null) {
  const b = pointsBounds(stroke.points);
  return {
    passId,
    strokeId: stroke.id,
    panel: stroke.panel,
    tool: stroke.tool,
    grey: stroke.grey,
    size: stroke.size,
    points: Buffer.from(encodePoints(stroke.points)),
    pointCount: stroke.points.length,
    minX: b.x,
    minY: b.y,
    maxX: b.x + b.w,
    maxY: b.y + b.h,
    addedSeq: seq,
    removedSeq: null,
    addedBy: userId,
  };
}

/** The strokes as they stood at `seq`: rows live then, shifted by their moves up to then. */
export async function strokesAt(db: Db, passId: string, seq: number) {
  const rows = await db
    .selectFrom('strokes')
    .selectAll()
    .where('passId', '=', passId)
    .where('addedSeq', '<=', seq)
    .where((eb) => eb.or([eb('removedSeq', 'is', null), eb('removedSeq', '>', seq)]))
    .orderBy('addedSeq')
    .orderBy('rowId')
    .execute();
  const moves = await db
    .selectFrom('strokeMoves')
    .select((eb) => ['rowId', eb.fn.sum<number>('dx').as('dx'), eb.fn.sum<number>('dy').as('dy')])
    .where('passId', '=', passId)
    .where('seq', '<=', seq)
    .groupBy('rowId')
    .execute();
  const offsets = new Map(moves.map((m) => [m.rowId, { dx: Number(m.dx), dy: Number(m.dy) }]));
  return rows.map((r) => ({ row: r, offset: offsets.get(r.rowId) ?? { dx: 0, dy: 0 } }));
}
