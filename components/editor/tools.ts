// The editor's tools and their settings: plain values shared by the toolbar,
// the gestures, the shortcuts and the stage (no React here).
export type Tool = 'pen' | 'tone' | 'eraser' | 'lasso' | 'room' | 'pan' | 'pin' | 'lightbox';

/** Number keys pick tools in this order (the toolbar's order too). */
export const TOOL_ORDER: Tool[] = ['pen', 'tone', 'eraser', 'lasso', 'room', 'pan', 'pin', 'lightbox'];

export type Guides = { bleed: boolean; trim: boolean; safe: boolean; panels: boolean };

/** Nib widths in mm. */
export const PEN_SIZES = [0.3, 0.5, 0.8, 1.2, 2];
export const TONE_SIZES = [3, 5, 8, 12];
/** The eraser's reach on screen, whatever the zoom. */
export const ERASER_RADIUS_PX = 10;

/** Who may pick a tool: the view for everyone, the pin for commenters, the rest for those who draw. */
export function toolAllowed(tool: Tool, can: { draw: boolean; comment: boolean }): boolean {
  return tool === 'pan' || (tool === 'pin' ? can.comment : can.draw);
}

/** The next size in `sizes` from `current`, one step down (-1) or up (+1), staying in range. */
export function stepSize(sizes: readonly number[], current: number, dir: -1 | 1): number {
  const i = sizes.indexOf(current);
  if (i < 0) return current;
  return sizes[Math.min(sizes.length - 1, Math.max(0, i + dir))]!;
}
