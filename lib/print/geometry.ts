// Print geometry of a square gag page. All lengths are millimetres, measured
// from the trim box's top-left corner (x to the right, y down).

export const MM_PER_INCH = 25.4; // exact, by definition of the inch
export const PT_PER_INCH = 72; // the PostScript/PDF point

export type Rect = { x: number; y: number; w: number; h: number };

/** What a page needs to be laid out: trim size, bleed, safe margin, gutter between panels. */
export type PageSpec = {
  trimW: number;
  trimH: number;
  bleed: number;
  safe: number;
  gutter: number;
};

/** The series default until volumes bring their own (PRODUCT.md / issue 3). */
export const DEFAULT_PAGE_SPEC: PageSpec = { trimW: 150, trimH: 150, bleed: 3, safe: 5, gutter: 4 };

export function mmToPt(mm: number): number {
  return (mm / MM_PER_INCH) * PT_PER_INCH;
}
export function ptToMm(pt: number): number {
  return (pt / PT_PER_INCH) * MM_PER_INCH;
}
export function mmToPx(mm: number, ppi: number): number {
  return (mm / MM_PER_INCH) * ppi;
}
export function pxToMm(px: number, ppi: number): number {
  return (px / ppi) * MM_PER_INCH;
}

/** The trim box grown by the bleed on every side. */
export function bleedBox(spec: PageSpec): Rect {
  return { x: -spec.bleed, y: -spec.bleed, w: spec.trimW + 2 * spec.bleed, h: spec.trimH + 2 * spec.bleed };
}

/** The trim box shrunk by the safe margin on every side: keep what matters inside. */
export function safeBox(spec: PageSpec): Rect {
  return { x: spec.safe, y: spec.safe, w: spec.trimW - 2 * spec.safe, h: spec.trimH - 2 * spec.safe };
}

/**
 * The 2×2 panel grid filling the safe area with `gutter` between panels, in
 * reading order for a left-to-right page: 0 setup (top left), 1 build (top right),
 * 2 turn (bottom left), 3 payoff (bottom right).
 */
export function panelRects(spec: PageSpec): Rect[] {
  const s = safeBox(spec);
  const w = (s.w - spec.gutter) / 2;
  const h = (s.h - spec.gutter) / 2;
  return [0, 1, 2, 3].map((i) => ({
    x: s.x + (i % 2) * (w + spec.gutter),
    y: s.y + Math.floor(i / 2) * (h + spec.gutter),
    w,
    h,
  }));
}

export function containsPoint(r: Rect, x: number, y: number): boolean {
  return x >= r.x && x <= r.x + r.w && y >= r.y && y <= r.y + r.h;
}

/** Which panel holds a point, or null in the gutters and margins. */
export function panelAt(spec: PageSpec, x: number, y: number): number | null {
  const i = panelRects(spec).findIndex((r) => containsPoint(r, x, y));
  return i < 0 ? null : i;
}

/** A spec is usable when the panels come out with positive size. */
export function specProblems(spec: PageSpec): string[] {
  const out: string[] = [];
  if (spec.safe * 2 + spec.gutter >= Math.min(spec.trimW, spec.trimH)) {
    out.push('The safe margins and the gutter leave no room for panels.');
  }
  return out;
}
