// The editor's view: millimetres on the page ↔ CSS pixels on the screen.
// scale is CSS px per mm; (originX, originY) is where the page's (0, 0) mm lands.

export type View = { scale: number; originX: number; originY: number };

export function toScreen(v: View, xMm: number, yMm: number): { x: number; y: number } {
  return { x: v.originX + xMm * v.scale, y: v.originY + yMm * v.scale };
}

export function toPage(v: View, xPx: number, yPx: number): { x: number; y: number } {
  return { x: (xPx - v.originX) / v.scale, y: (yPx - v.originY) / v.scale };
}

/** Zooms by `factor` keeping the page point under (px, py) where it is. */
export function zoomAt(v: View, factor: number, px: number, py: number, min = 0.5, max = 80): View {
  const scale = Math.min(max, Math.max(min, v.scale * factor));
  const k = scale / v.scale;
  return { scale, originX: px - (px - v.originX) * k, originY: py - (py - v.originY) * k };
}

/** Fits a page box of w × h mm (top-left at bx, by) into a screen area with a margin. */
export function fitView(bx: number, by: number, w: number, h: number, screenW: number, screenH: number, margin = 24): View {
  const scale = Math.max(0.1, Math.min((screenW - 2 * margin) / w, (screenH - 2 * margin) / h));
  return {
    scale,
    originX: (screenW - w * scale) / 2 - bx * scale,
    originY: (screenH - h * scale) / 2 - by * scale,
  };
}
