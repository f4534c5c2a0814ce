// The vector model of a pass. Coordinates are millimetres from the trim box's
// top-left corner; pressure is 0..1. Ids are made by the client (nanoid).

export const TOOLS = ['pen', 'tone'] as const;
export type StrokeTool = (typeof TOOLS)[number];

export type Point = [x: number, y: number, pressure: number];

export type Stroke = {
  id: string;
  /** 0 setup, 1 build, 2 turn, 3 payoff: the panel that clips the stroke. */
  panel: number;
  tool: StrokeTool;
  /** 0 = white … 100 = black. */
  grey: number;
  /** Nominal width in mm. */
  size: number;
  points: Point[];
};

export const ROOM_SHAPES = ['rect', 'ellipse'] as const;
export type RoomShape = (typeof ROOM_SHAPES)[number];

/** A balloon room: a region of a panel reserved for a balloon or caption. */
export type Room = { id: string; panel: number; shape: RoomShape; x: number; y: number; w: number; h: number };

export const ROTATIONS = [0, 90, 180, 270] as const;
export type Rotation = (typeof ROTATIONS)[number];

/**
 * An upload placed under the strokes of a pass, on the whole page (panel null)
 * or one panel (clipped to it). x, y, w, h is the box the image covers on the
 * page after its rotation (clockwise, in quarter turns). Never part of the ink.
 */
export type Lightbox = {
  id: string;
  uploadId: string;
  panel: number | null;
  x: number;
  y: number;
  w: number;
  h: number;
  rotation: Rotation;
  opacity: number;
  visible: boolean;
};

export type Op =
  | { op: 'add'; stroke: Stroke }
  | { op: 'remove'; strokeId: string }
  | { op: 'move'; strokeIds: string[]; dx: number; dy: number }
  | { op: 'room'; room: Room }
  | { op: 'unroom'; roomId: string }
  | { op: 'lightbox'; lightbox: Lightbox }
  | { op: 'unlightbox'; lightboxId: string };

export const MAX_POINTS_PER_STROKE = 10_000;
export const MAX_BATCH_BYTES = 1_000_000;
/**
 * The most a pass may hold (its live strokes and their points): far beyond any
 * thumbnail (the demo's passes have a few hundred strokes), and small enough
 * that its SVG, findings and PDF page stay a matter of seconds.
 */
export const MAX_PASS_STROKES = 50_000;
export const MAX_PASS_POINTS = 3_000_000;

/** Tone marker levels offered in the editor (percent black). */
export const TONE_GREYS = [20, 40, 60, 80] as const;

export function greyToCss(grey: number, alpha = 1): string {
  const v = Math.round(255 * (1 - Math.min(100, Math.max(0, grey)) / 100));
  return alpha >= 1 ? `rgb(${v},${v},${v})` : `rgba(${v},${v},${v},${alpha})`;
}

/** Tone is translucent so values can be layered; pen is opaque. */
export function strokeAlpha(tool: StrokeTool): number {
  return tool === 'tone' ? 0.55 : 1;
}

export function translatePoints(points: Point[], dx: number, dy: number): Point[] {
  if (dx === 0 && dy === 0) return points;
  return points.map(([x, y, p]) => [x + dx, y + dy, p]);
}
