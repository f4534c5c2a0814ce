// The arithmetic of a printed volume (pure). Lengths in mm unless the name says pt or px.
import { MM_PER_INCH, type PageSpec, mmToPt, mmToPx, safeBox } from './geometry';

export type Binding = 'saddle' | 'perfect';
export type ReadingDirection = 'ltr' | 'rtl';

export type VolumeSpec = PageSpec & {
  binding: Binding;
  /** Paper thickness in micrometres, for the spine. */
  caliperUm: number;
  direction: ReadingDirection;
};

export const TRIM_PRESETS = {
  square150: { label: '150 mm square', trimW: 150, trimH: 150 },
  square6in: { label: '6 in square', trimW: 6 * MM_PER_INCH, trimH: 6 * MM_PER_INCH },
  a5: { label: 'A5 (148 × 210 mm)', trimW: 148, trimH: 210 },
} as const;

export const BLEED_PRESETS = { mm3: 3, in8: MM_PER_INCH / 8 } as const;

export const DEFAULT_VOLUME_SPEC: VolumeSpec = {
  trimW: 150,
  trimH: 150,
  bleed: 3,
  safe: 5,
  gutter: 4,
  binding: 'saddle',
  caliperUm: 100,
  direction: 'ltr',
};

export function mmToIn(mm: number): number {
  return mm / MM_PER_INCH;
}
export function inToMm(inches: number): number {
  return inches * MM_PER_INCH;
}

/** Pixels needed to fill a length at a resolution, rounded up to whole pixels. */
export function pixelsAt(mm: number, ppi: number): number {
  return Math.ceil(mmToPx(mm, ppi) - 1e-9);
}

export type PdfBox = [x0: number, y0: number, x1: number, y1: number];

/**
 * PDF page boxes in points, origin at the bottom left of the page:
 * MediaBox = BleedBox = the trim plus the bleed on every side; TrimBox inside it.
 */
export function pdfBoxes(spec: PageSpec): { media: PdfBox; bleed: PdfBox; trim: PdfBox; safe: PdfBox } {
  const b = mmToPt(spec.bleed);
  const w = mmToPt(spec.trimW + 2 * spec.bleed);
  const h = mmToPt(spec.trimH + 2 * spec.bleed);
  const media: PdfBox = [0, 0, w, h];
  const s = safeBox(spec);
  return {
    media,
    bleed: media,
    trim: [b, b, b + mmToPt(spec.trimW), b + mmToPt(spec.trimH)],
    safe: [b + mmToPt(s.x), b + mmToPt(spec.trimH - s.y - s.h), b + mmToPt(s.x + s.w), b + mmToPt(spec.trimH - s.y)],
  };
}

/** Saddle stitching folds sheets of 4 pages: a multiple of 4. Perfect binding glues leaves: even. */
export function pageCountValid(pages: number, binding: Binding): boolean {
  if (pages <= 0) return false;
  return binding === 'saddle' ? pages % 4 === 0 : pages % 2 === 0;
}

export function blanksNeeded(pages: number, binding: Binding): number {
  const unit = binding === 'saddle' ? 4 : 2;
  return (unit - (pages % unit)) % unit;
}

/** Spine width = pages ÷ 2 × paper caliper (each leaf is two pages). */
export function spineMm(pages: number, caliperUm: number): number {
  return (pages / 2) * (caliperUm / 1000);
}

/** The spine a binding has: perfect binding glues leaves to a flat spine; a saddle-stitched book folds on its staples and has none. */
export function bookSpineMm(pages: number, binding: Binding, caliperUm: number): number | null {
  return binding === 'perfect' ? spineMm(pages, caliperUm) : null;
}

/** Said beside every page count and spine figure: printers differ, and their own sheet wins. */
export const CONFIRM_WITH_PRINTER = 'Confirm with your printer: their own specification takes precedence.';

/** Sheets to fold for saddle stitch (4 pages each), leaves for perfect binding (2 pages each). */
export function sheetsNeeded(pages: number, binding: Binding): number {
  return Math.ceil(pages / (binding === 'saddle' ? 4 : 2));
}

export type Spread = [left: number | null, right: number | null];

/**
 * Spreads as the reader sees them. Left-to-right: page 1 alone on the right,
 * then 2|3, 4|5 …; right-to-left books mirror it (page 1 alone on the left).
 */
export function readerSpreads(pages: number, direction: ReadingDirection = 'ltr'): Spread[] {
  const out: Spread[] = [];
  if (pages <= 0) return out;
  const ltr = (a: number | null, b: number | null): Spread => (direction === 'ltr' ? [a, b] : [b, a]);
  out.push(ltr(null, 1));
  for (let p = 2; p <= pages; p += 2) out.push(ltr(p, p + 1 <= pages ? p + 1 : null));
  return out;
}

/**
 * Printer spreads for saddle stitch: the pages that share a side of a sheet,
 * pairs summing to n + 1, outer and inner alternating: 8 pages → 8|1, 2|7, 6|3, 4|5.
 * A right-to-left book opens from the other side, so every pair is mirrored (1|8, 7|2 …):
 * its page 1 lies on the sheet's left half, as its reader spreads put page 1 on the left.
 */
export function printerSpreads(pages: number, direction: ReadingDirection = 'ltr'): Spread[] {
  if (pages <= 0 || pages % 4 !== 0) return [];
  const out: Spread[] = [];
  for (let k = 0; k < pages / 2; k++) {
    const pair: Spread = k % 2 === 0 ? [pages - k, k + 1] : [k + 1, pages - k];
    out.push(direction === 'ltr' ? pair : [pair[1], pair[0]]);
  }
  return out;
}

/** Where blank pages go best: after the last gag, before the back matter. */
export function blankSuggestion(kinds: string[]): number {
  const BACK = new Set(['afterword', 'credits', 'inside-back', 'back-cover']);
  let i = kinds.length;
  while (i > 0 && BACK.has(kinds[i - 1]!)) i--;
  return i; // index to insert the blanks at
}
