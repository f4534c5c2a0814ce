// Where a final page's scan lands on the page (pure). All lengths are millimetres
// from the trim box's top-left corner (x to the right, y down). The fit names a box
// (the trim or the bleed): at scale 1 and no offset the scan, turned clockwise by its
// quarter turns, covers that box exactly along one side and is centred on it; `scale`
// grows or shrinks it about the box's centre and (x, y) moves it. The result is a box
// with a rotation, the shape a lightbox has, so the editor, the SVG and the PDF draw
// it with the same arithmetic.
import { MM_PER_INCH, type PageSpec, type Rect, bleedBox } from './geometry';

export type Quarter = 0 | 90 | 180 | 270;
/** A scan's kind: line art (1-bit or near), greyscale tone, or a colour file. */
export type ScanColour = 'grey' | 'line' | 'rgb';
export type FitTarget = 'trim' | 'bleed';
export type Fit = { to: FitTarget; x: number; y: number; scale: number; rotation: Quarter };
/** The scan's box on the page after its turn, and the turn: like a lightbox's x, y, w, h, rotation. */
export type Placed = Rect & { rotation: Quarter };
export type ScanSize = { width: number; height: number };

export const turnedQ = (rotation: Quarter) => rotation === 90 || rotation === 270;

export function targetBox(spec: PageSpec, to: FitTarget): Rect {
  return to === 'bleed' ? bleedBox(spec) : { x: 0, y: 0, w: spec.trimW, h: spec.trimH };
}

/** The scan's box on the page (after its clockwise turn). */
export function placedBox(spec: PageSpec, fit: Fit, scan: ScanSize): Placed {
  const box = targetBox(spec, fit.to);
  const iw = turnedQ(fit.rotation) ? scan.height : scan.width;
  const ih = turnedQ(fit.rotation) ? scan.width : scan.height;
  const cover = Math.max(box.w / iw, box.h / ih);
  const w = iw * cover * fit.scale;
  const h = ih * cover * fit.scale;
  return { x: box.x + box.w / 2 + fit.x - w / 2, y: box.y + box.h / 2 + fit.y - h / 2, w, h, rotation: fit.rotation };
}

/**
 * Effective resolution along the scan's own axes (its pixel rows, x, and columns, y):
 * pixels ÷ the inches that axis spans on the page (1 in = 25.4 mm). A quarter turn lays
 * the scan's x axis along the page's height.
 */
export function placedPpi(placed: Placed, scan: ScanSize): { x: number; y: number } {
  const alongX = turnedQ(placed.rotation) ? placed.h : placed.w;
  const alongY = turnedQ(placed.rotation) ? placed.w : placed.h;
  return { x: scan.width / (alongX / MM_PER_INCH), y: scan.height / (alongY / MM_PER_INCH) };
}

/** The scan's size at the resolution its file records, in mm (null when it records none). */
export function nativeSize(scan: ScanSize & { ppi: number | null }): { w: number; h: number } | null {
  if (!scan.ppi || !(scan.ppi > 0)) return null;
  return { w: (scan.width / scan.ppi) * MM_PER_INCH, h: (scan.height / scan.ppi) * MM_PER_INCH };
}

/**
 * The fit a new final page starts with: to the bleed when the scan, at the resolution it
 * records, is the size of the bleed box (within 1.5 mm: drawn and scanned with its bleed),
 * otherwise to the trim. Either way it covers its box; a person then fits it.
 */
export function defaultFit(spec: PageSpec, scan: ScanSize & { ppi: number | null }): Fit {
  const native = nativeSize(scan);
  const bleed = bleedBox(spec);
  const withBleed = native !== null && spec.bleed > 0 && Math.abs(native.w - bleed.w) <= 1.5 && Math.abs(native.h - bleed.h) <= 1.5;
  return { to: withBleed ? 'bleed' : 'trim', x: 0, y: 0, scale: 1, rotation: 0 };
}

/** A point of the page (mm) → the scan's pixel under it (fractional), or null off the scan. Inverse of the placement. */
export function pageToScan(placed: Placed, scan: ScanSize, x: number, y: number): { px: number; py: number } | null {
  // Unit coordinates inside the placed box (0…1 across, 0…1 down).
  const u = (x - placed.x) / placed.w;
  const v = (y - placed.y) / placed.h;
  if (u < 0 || u > 1 || v < 0 || v > 1) return null;
  // Undo the clockwise turn: the box's top-left corner shows the scan's corner that the turn brought there.
  const [su, sv] = placed.rotation === 0 ? [u, v] : placed.rotation === 90 ? [v, 1 - u] : placed.rotation === 180 ? [1 - u, 1 - v] : [1 - v, u];
  return { px: su * scan.width, py: sv * scan.height };
}

/** The scan's pixel → the page point it lands on (mm); the forward map of pageToScan. */
export function scanToPage(placed: Placed, scan: ScanSize, px: number, py: number): { x: number; y: number } {
  const su = px / scan.width;
  const sv = py / scan.height;
  const [u, v] = placed.rotation === 0 ? [su, sv] : placed.rotation === 90 ? [1 - sv, su] : placed.rotation === 180 ? [1 - su, 1 - sv] : [sv, 1 - su];
  return { x: placed.x + u * placed.w, y: placed.y + v * placed.h };
}

/**
 * The scan's own rectangle before its turn, centred where the placed box is: an SVG
 * `<image>` or a PDF image matrix draws it this size about (cx, cy), then turns it
 * clockwise by `rotation` about that centre — the same as a lightbox is drawn.
 */
export function imageFrame(p: Placed): { cx: number; cy: number; w: number; h: number; rotation: Quarter } {
  const t = turnedQ(p.rotation);
  return { cx: p.x + p.w / 2, cy: p.y + p.h / 2, w: t ? p.h : p.w, h: t ? p.w : p.h, rotation: p.rotation };
}
