// Moving a gag between the board's status columns by drag or keyboard: which column a
// card is over, how the arrow keys step it from column to column, and whether a drop
// there is allowed — by the same rule the server enforces (lib/gags/status).
import type { CollisionDetection, KeyboardCoordinateGetter } from '@dnd-kit/core';
import type { GagDto } from '@/db/queries/gags';
import { GAG_STATUSES, type GagStatus, type StatusCheck, checkManualMove } from '@/lib/gags/status';

const PREFIX = 'status:';
export const columnId = (s: GagStatus) => `${PREFIX}${s}`;
export function statusOfColumn(id: string | number | null | undefined): GagStatus | null {
  const s = String(id ?? '');
  if (!s.startsWith(PREFIX)) return null;
  const status = s.slice(PREFIX.length) as GagStatus;
  return GAG_STATUSES.includes(status) ? status : null;
}

/** Whether a person may drop this gag in that column; the reason when not. */
export function dropCheck(gag: Pick<GagDto, 'status' | 'stamp'>, to: GagStatus): StatusCheck {
  return checkManualMove(gag.status, to, { readyStampStands: gag.stamp?.decision === 'ready' && gag.stamp.standing });
}

/**
 * The column a dragged card is over. With a pointer, the column under it (none off the
 * columns: a drop there changes nothing); with the keyboard, the column under the
 * card's centre, or the nearest one sideways — columns differ in height, so a centre-to-
 * centre distance would pick the wrong one.
 */
export const columnCollisions: CollisionDetection = ({ collisionRect, droppableRects, droppableContainers, pointerCoordinates }) => {
  if (pointerCoordinates) {
    const { x, y } = pointerCoordinates;
    const hit = droppableContainers.find((c) => {
      const r = droppableRects.get(c.id);
      return r && x >= r.left && x <= r.right && y >= r.top && y <= r.bottom;
    });
    return hit ? [{ id: hit.id, data: { droppableContainer: hit, value: 0 } }] : [];
  }
  const x = collisionRect.left + collisionRect.width / 2;
  let best: (typeof droppableContainers)[number] | null = null;
  let bestD = Infinity;
  for (const c of droppableContainers) {
    const r = droppableRects.get(c.id);
    if (!r) continue;
    const d = x < r.left ? r.left - x : x > r.right ? x - r.right : 0;
    if (d < bestD) [best, bestD] = [c, d];
  }
  return best ? [{ id: best.id, data: { droppableContainer: best, value: bestD } }] : [];
};

/** Left and right arrows step a picked-up card one column over, at the height it is; up and down do nothing. */
export const columnKeys: KeyboardCoordinateGetter = (event, { context }) => {
  if (!['ArrowLeft', 'ArrowRight', 'ArrowUp', 'ArrowDown'].includes(event.code)) return undefined;
  event.preventDefault();
  if (event.code === 'ArrowUp' || event.code === 'ArrowDown') return undefined;
  const { collisionRect, droppableRects, droppableContainers } = context;
  if (!collisionRect) return undefined;
  const columns = droppableContainers
    .getEnabled()
    .flatMap((c) => {
      const r = droppableRects.get(c.id);
      return r ? [r] : [];
    })
    .sort((a, b) => a.left - b.left);
  if (columns.length === 0) return undefined;
  const x = collisionRect.left + collisionRect.width / 2;
  let cur = columns.findIndex((r) => x >= r.left && x <= r.right);
  if (cur < 0)
    cur = columns.reduce(
      (best, r, i) => (Math.abs(r.left + r.width / 2 - x) < Math.abs(columns[best]!.left + columns[best]!.width / 2 - x) ? i : best),
      0,
    );
  const next = columns[Math.max(0, Math.min(columns.length - 1, cur + (event.code === 'ArrowRight' ? 1 : -1)))]!;
  return { x: next.left + (next.width - collisionRect.width) / 2, y: collisionRect.top };
};
