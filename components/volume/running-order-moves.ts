// Where a page or a gag lands in the running order when it is dropped, said the
// same way to the eye, to the screen reader and to the server; and how the arrow
// keys step a gag from the unplaced list through the running order's places
// (dnd-kit's sortable keys only know the pages already in the list).
import { type CollisionDetection, type KeyboardCoordinateGetter, closestCenter } from '@dnd-kit/core';
import { arrayMove, hasSortableData } from '@dnd-kit/sortable';
import type { EntryDto } from '@/db/queries/volumes';
import { entryLabel } from '@/lib/print/matter';

/** The running order's sortable list (its SortableContext id). */
export const RUNNING_ORDER_ID = 'running-order';
/** The place after the last page: drop a gag here to add it at the end. */
export const END_SLOT = 'running-order-end';
/** Unplaced gags are dragged as `gag:<id>`; pages by their entry id. */
export const UNPLACED_PREFIX = 'gag:';

export const isUnplaced = (id: string | number) => String(id).startsWith(UNPLACED_PREFIX);

export type Landing = {
  /** The page number it will have, from 1. */
  page: number;
  /** The pages it will sit between (null at either end). */
  after: EntryDto | null;
  before: EntryDto | null;
  /** What to ask the server: nothing (it stays), append, or a place next to a page. */
  request: 'none' | 'append' | { before: string } | { after: string };
};

/** Where `activeId` lands when dropped over `overId` (an entry, or the end), or null when that is no place. */
export function landing(activeId: string, overId: string | null, entries: EntryDto[]): Landing | null {
  if (overId === null) return null;
  const n = entries.length;
  if (isUnplaced(activeId)) {
    // A gag from the unplaced list goes in before the page it is over, or after the last one.
    const at = overId === END_SLOT ? n : entries.findIndex((e) => e.id === overId);
    if (at < 0) return null;
    return { page: at + 1, after: entries[at - 1] ?? null, before: entries[at] ?? null, request: at === n ? 'append' : { before: overId } };
  }
  const from = entries.findIndex((e) => e.id === activeId);
  if (from < 0) return null;
  const to = overId === END_SLOT ? n - 1 : entries.findIndex((e) => e.id === overId);
  if (to < 0) return null;
  const next = arrayMove(entries, from, to);
  const request = to === from ? 'none' : to > from ? { after: entries[to]!.id } : { before: entries[to]!.id };
  return { page: to + 1, after: next[to - 1] ?? null, before: next[to + 1] ?? null, request };
}

/** "page 3, after Title page" — where it stands, never sounding like it replaces a page. */
export function sayPlace(l: Landing): string {
  if (l.after) return `page ${l.page}, after ${entryLabel(l.after)}`;
  if (l.before) return `page ${l.page}, before ${entryLabel(l.before)}`;
  return `page ${l.page}`;
}

/** What is being moved, as the announcements name it. */
export function sayWhat(id: string, entries: EntryDto[], unplaced: { id: string; title: string }[]): string {
  if (isUnplaced(id)) {
    const g = unplaced.find((x) => `${UNPLACED_PREFIX}${x.id}` === id);
    return g ? `The gag ${g.title}` : 'The gag';
  }
  const i = entries.findIndex((e) => e.id === id);
  return i >= 0 ? `Page ${i + 1}, ${entryLabel(entries[i]!)}` : 'The page';
}

/**
 * Arrow keys while dragging: one place up or down a key, so the drop lands where the last
 * announcement said. A page of the list steps through the list's pages by their index; a gag
 * from the unplaced list through those and then END_SLOT. Where it is now is read from the
 * dragged row itself, never from `over`, which lags behind a key pressed while the list is still
 * re-rendering the last one (a step was lost that way on a busy machine).
 */
export const runningOrderKeys: KeyboardCoordinateGetter = (event, args) => {
  if (!['ArrowUp', 'ArrowDown', 'ArrowLeft', 'ArrowRight'].includes(event.code)) return undefined;
  const fromList = !isUnplaced(args.active);
  event.preventDefault();
  const { droppableRects, droppableContainers, collisionRect, scrollAdjustedTranslate } = args.context;
  const enabled = droppableContainers.getEnabled();
  const pages = enabled
    .flatMap((c) =>
      hasSortableData(c) && c.data.current.sortable.containerId === RUNNING_ORDER_ID ? [{ id: String(c.id), at: c.data.current.sortable.index }] : [],
    )
    .sort((a, b) => a.at - b.at)
    .map((p) => p.id);
  const ids = !fromList && enabled.some((c) => c.id === END_SLOT) ? [...pages, END_SLOT] : pages;
  if (!collisionRect || ids.length === 0) return undefined;
  // Where it is now: the place nearest the dragged row (what closestCenter will say), read from
  // the row itself, which is up to date at each key even when `over` lags behind fast presses.
  // A page starts at its own place; a gag not moved yet is over the end (runningOrderCollisions).
  const moved = !!scrollAdjustedTranslate && (scrollAdjustedTranslate.x !== 0 || scrollAdjustedTranslate.y !== 0);
  const cur = fromList || moved ? nearest(ids, droppableRects, collisionRect) : ids.indexOf(END_SLOT);
  const down = event.code === 'ArrowDown' || event.code === 'ArrowRight';
  const next = cur < 0 ? (down ? 0 : ids.length - 1) : Math.max(0, Math.min(ids.length - 1, cur + (down ? 1 : -1)));
  const rect = droppableRects.get(ids[next]!);
  if (!rect) return undefined;
  // Centre the dragged row on that place: the closest centre is then that place.
  return { x: rect.left + (rect.width - collisionRect.width) / 2, y: rect.top + (rect.height - collisionRect.height) / 2 };
};

function nearest(ids: string[], rects: Map<string | number, { top: number; height: number }>, row: { top: number; height: number }): number {
  const mid = row.top + row.height / 2;
  let best = -1;
  let bestD = Infinity;
  ids.forEach((id, i) => {
    const r = rects.get(id);
    if (!r) return;
    const d = Math.abs(r.top + r.height / 2 - mid);
    if (d < bestD) [best, bestD] = [i, d];
  });
  return best;
}

/**
 * closestCenter, except that a gag picked up from the unplaced list with the keyboard
 * (no pointer) starts over the end of the running order — where "add" puts it — rather
 * than over whichever page happens to be level with the unplaced list.
 */
export const runningOrderCollisions: CollisionDetection = (args) => {
  const { active, collisionRect, pointerCoordinates, droppableContainers } = args;
  const start = active.rect.current.initial;
  if (
    isUnplaced(active.id) &&
    pointerCoordinates === null &&
    start &&
    Math.abs(start.top - collisionRect.top) < 1 &&
    Math.abs(start.left - collisionRect.left) < 1 &&
    droppableContainers.some((c) => c.id === END_SLOT)
  ) {
    return [{ id: END_SLOT }];
  }
  return closestCenter(args);
};
