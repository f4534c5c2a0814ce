// Readability findings of a pass, per panel (pure). They measure the same
// outlines the editor and the thumbnails draw (lib/strokes/outline).
import { type PageSpec, type Rect, panelRects, safeBox } from '@/lib/print/geometry';
import { BEAT_KINDS, type BeatKind } from '@/lib/gags/status';
import { outlineOf } from '@/lib/strokes/outline';
import type { Room, Stroke } from '@/lib/strokes/types';
import { CoverageGrid } from './raster';

export const DEFAULT_INK_THRESHOLD = 0.35;
/**
 * Grid cells per panel side (at least 256 asked). Sampling cell centres, the
 * error on a thin mark is about one cell row along each edge; at 2,048 a 68 mm
 * panel has 0.033 mm cells and a 1 mm line stays within 1% of its true area.
 */
export const INK_GRID = 2048;

export type PanelFindings = {
  panel: number;
  /** Share of the panel covered by marks, 0..1. */
  inkLoad: number;
  inkHeavy: boolean;
  /** Strokes that reach into a balloon room of their panel. */
  roomIntrusions: number;
  roomIntrusionIds: string[];
  /** Strokes whose marks run outside the safe area (they are clipped there). */
  outsideSafe: number;
  outsideSafeIds: string[];
  empty: boolean;
};

export type Findings = { panels: PanelFindings[]; beatsMissing: BeatKind[]; inkThreshold: number };

/** Distance-aware test: does a disc of radius r at (x, y) touch the room? */
export function discTouchesRoom(x: number, y: number, r: number, room: Pick<Room, 'shape' | 'x' | 'y' | 'w' | 'h'>): boolean {
  if (room.shape === 'rect') {
    const cx = Math.max(room.x, Math.min(x, room.x + room.w));
    const cy = Math.max(room.y, Math.min(y, room.y + room.h));
    return (cx - x) ** 2 + (cy - y) ** 2 <= r * r;
  }
  // An ellipse grown by r on each semi-axis: close enough for marks a few tenths of a mm wide.
  const rx = room.w / 2 + r;
  const ry = room.h / 2 + r;
  const dx = x - (room.x + room.w / 2);
  const dy = y - (room.y + room.h / 2);
  return (dx * dx) / (rx * rx) + (dy * dy) / (ry * ry) <= 1;
}

function outside(poly: [number, number][], box: Rect): boolean {
  const eps = 1e-6;
  return poly.some(([x, y]) => x < box.x - eps || y < box.y - eps || x > box.x + box.w + eps || y > box.y + box.h + eps);
}

/** Ink load of one panel: the union of the stroke outlines clipped to the panel. */
export function panelInkLoad(panel: Rect, outlines: [number, number][][], grid = INK_GRID): number {
  const g = new CoverageGrid(panel, grid, grid);
  for (const poly of outlines) g.fillPolygon(poly);
  return g.coverage();
}

export function computeFindings(
  spec: PageSpec,
  strokes: Stroke[],
  rooms: Room[],
  beats: { kind: BeatKind; note: string }[],
  inkThreshold = DEFAULT_INK_THRESHOLD,
): Findings {
  const panels = panelRects(spec);
  const safe = safeBox(spec);
  const panelsOut: PanelFindings[] = panels.map((rect, i) => {
    const own = strokes.filter((s) => s.panel === i);
    const outlines = own.map((s) => outlineOf(s));
    const inkLoad = panelInkLoad(rect, outlines.flat());
    const myRooms = rooms.filter((r) => r.panel === i);
    const intruders = own.filter((s) => myRooms.some((room) => s.points.some(([x, y]) => discTouchesRoom(x, y, s.size / 2, room))));
    const out = own.filter((_, k) => outlines[k]!.some((poly) => outside(poly, safe)));
    return {
      panel: i,
      inkLoad,
      inkHeavy: inkLoad > inkThreshold,
      roomIntrusions: intruders.length,
      roomIntrusionIds: intruders.map((s) => s.id),
      outsideSafe: out.length,
      outsideSafeIds: out.map((s) => s.id),
      empty: own.length === 0,
    };
  });
  const noted = new Set(beats.filter((b) => b.note.trim() !== '').map((b) => b.kind));
  return { panels: panelsOut, beatsMissing: BEAT_KINDS.filter((k) => !noted.has(k)), inkThreshold };
}
