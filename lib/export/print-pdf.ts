// The print file and the cover file. Every page is the trim plus the bleed, with
// MediaBox = BleedBox and the TrimBox inside (ISO 32000-1 §14.11.2); each final page's
// scan is placed by its fit (lib/print/final-fit.ts, the geometry the fit view and the
// preflight use) and embedded at its own pixels through pdf-stream.ts, one page's
// pixels in memory at a time. A proof adds a slug around the bleed for the words
// "PROOF — NOT FOR PRINT", and lets the newest pass stand in for a missing scan.
import { PDFDocument, type PDFFont, PDFName } from 'pdf-lib';
import { type Fit, imageFrame, placedBox } from '@/lib/print/final-fit';
import { type PageSpec, type Rect, bleedBox, mmToPt } from '@/lib/print/geometry';
import type { Room, Stroke } from '@/lib/strokes/types';
import { Opacities, ContentWriter, newDoc, pt, rectPath } from './pdf-content';
import { type Sheet, centred, drawPanels, placer, textAt } from './pdf';
import { DeferredStreams, writePdfFile } from './pdf-stream';
import { type KeptScan, imageStream } from './print-image';

/** The slug a proof adds around the bleed, for its marks (mm). */
export const PROOF_SLUG_MM = 8;
export const PROOF_MARK = 'PROOF — NOT FOR PRINT';

/** A final page's scan: where its kept file is, and its fit. */
export type PrintArt = Omit<KeptScan, 'path'> & { id: string; fit: Fit };

export type PrintPage = {
  /** The page number in the book. */
  number: number;
  label: string;
  /** Added by the print file so the page count suits the binding. */
  addedBlank?: boolean;
  art: PrintArt | null;
  /** Proof only: the newest pass standing in for a missing scan. */
  standIn?: { passNumber: number; strokes: Stroke[]; rooms: Room[] } | null;
};

export type PrintInput = {
  spec: PageSpec;
  title: string;
  proof: boolean;
  /** Fetches a kept scan to a file on disk; `done` removes it. */
  fetchScan: (art: PrintArt) => Promise<{ path: string; done: () => Promise<void> }>;
  /** Told after each page's pixels are written. */
  onProgress?: (done: number, total: number) => void | Promise<void>;
};

/** The print file carries no text, so no font: only a proof's marks need one (embedded, subset). */
const document = (title: string, proof: boolean): Promise<{ doc: PDFDocument; font: PDFFont | null }> =>
  proof ? newDoc(`${title} — proof, not for print`) : newDoc(`${title} — print file`, { font: false });

/**
 * A page of `trimW` × `trimH` mm plus the bleed, and a proof's slug around it: MediaBox (with the slug),
 * BleedBox and TrimBox set, painted white to the bleed, with its drawing context.
 */
function sheetPage(
  doc: PDFDocument,
  ctx: { spec: PageSpec; out: ContentWriter; opacity: Opacities; slug: number },
  trimW: number,
  trimH: number,
): { sheet: Sheet; w: number; h: number } {
  const { spec, out, opacity, slug } = ctx;
  const bleedW = trimW + 2 * spec.bleed;
  const bleedH = trimH + 2 * spec.bleed;
  const [w, h] = [mmToPt(bleedW + 2 * slug), mmToPt(bleedH + 2 * slug)];
  const o = mmToPt(slug);
  const page = doc.addPage([w, h]);
  page.setMediaBox(0, 0, w, h);
  page.setBleedBox(o, o, mmToPt(bleedW), mmToPt(bleedH));
  page.setTrimBox(o + mmToPt(spec.bleed), o + mmToPt(spec.bleed), mmToPt(trimW), mmToPt(trimH));
  out.text(`q 1 1 1 rg ${rectPath(o, o, mmToPt(bleedW), mmToPt(bleedH))} f Q\n`);
  return { sheet: { page, out, opacity, at: placer(spec, h, mmToPt(slug + spec.bleed), mmToPt(slug + spec.bleed)) }, w, h };
}

/** The `cm` operators that draw an image's unit square as the placed scan: centred, sized, turned clockwise. */
export function imageMatrix(at: ReturnType<typeof placer>, placed: ReturnType<typeof placedBox>): string {
  const f = imageFrame(placed);
  const phi = (-f.rotation * Math.PI) / 180; // clockwise on the page is negative in PDF's y-up space
  const c = Math.round(Math.cos(phi));
  const s = Math.round(Math.sin(phi));
  return `1 0 0 1 ${pt(at.x(f.cx))} ${pt(at.y(f.cy))} cm ${c} ${s} ${-s} ${c} 0 0 cm ${pt(mmToPt(f.w))} 0 0 ${pt(mmToPt(f.h))} ${pt(-mmToPt(f.w) / 2)} ${pt(-mmToPt(f.h) / 2)} cm`;
}

const clip = (at: ReturnType<typeof placer>, r: Rect) => `${rectPath(at.x(r.x), at.y(r.y + r.h), mmToPt(r.w), mmToPt(r.h))} W n`;

type Placement = { art: PrintArt; trimLeft: number; area: Rect; spec: PageSpec; label: string };

/**
 * Places scans on a page (their image streams deferred) and returns the content for them.
 * `trimLeft` shifts a scan's trim box right (the cover's front and back share a sheet).
 */
function placeScans(deferred: DeferredStreams, sheet: Sheet, placements: Placement[], fill: (p: Placement) => ReturnType<typeof imageStream>) {
  placements.forEach((p, i) => {
    const ref = deferred.add({ Type: 'XObject', Subtype: 'Image' }, async () => {
      const s = await fill(p);
      return { bytes: s.bytes, dict: s.dict };
    });
    const key = PDFName.of(`QP${i}`);
    sheet.page.node.setXObject(key, ref);
    const at = { x: (mm: number) => sheet.at.x(mm + p.trimLeft), y: sheet.at.y };
    const placed = placedBox(p.spec, p.art.fit, p.art);
    sheet.out.text(`q ${clip(at, p.area)} ${imageMatrix(at, placed)} /${key.asString().slice(1)} Do Q\n`);
  });
}

/** A scan's image stream, its kept file fetched for the moment; a colour scan leaves a note. */
function filler(input: PrintInput, notes: string[], what: string) {
  return async (p: Placement) => {
    const got = await input.fetchScan(p.art);
    try {
      const s = await imageStream({ ...p.art, path: got.path });
      if (s.convertedToGrey) notes.push(`${p.label}: the scan is in colour; the ${what} has it in grey.`);
      return s;
    } finally {
      await got.done();
    }
  };
}

/** Writes the interior: one PDF page per book page, in order. */
export async function printPdf(pages: PrintPage[], input: PrintInput, file: string): Promise<{ bytes: number; notes: string[] }> {
  const { spec } = input;
  const { doc, font } = await document(input.title, input.proof);
  const deferred = new DeferredStreams(doc);
  const opacity = new Opacities(doc);
  const out = new ContentWriter();
  const notes: string[] = [];
  const slug = input.proof ? PROOF_SLUG_MM : 0;
  const o = mmToPt(slug);
  const fill = filler(input, notes, 'print file');
  for (const p of pages) {
    const { sheet, w, h } = sheetPage(doc, { spec, out, opacity, slug }, spec.trimW, spec.trimH);
    if (p.art) placeScans(deferred, sheet, [{ art: p.art, trimLeft: 0, area: bleedBox(spec), spec, label: `Page ${p.number}` }], fill);
    else if (p.standIn) drawPanels(sheet, spec, p.standIn.strokes, p.standIn.rooms, []);
    else if (font && !p.addedBlank) centred(sheet, font, p.label, 14, w / 2, h / 2, [0.47, 0.46, 0.49]);
    if (font) {
      const state = p.art
        ? 'final'
        : p.standIn
          ? `NOT FINAL: pass ${p.standIn.passNumber} stands in`
          : p.addedBlank
            ? 'blank added for the binding'
            : 'NOT FINAL: no scan yet';
      textAt(sheet, font, `${PROOF_MARK} · page ${p.number} · ${p.label} · ${state}`, 7, o, o / 2 - 2, [0.75, 0.1, 0.1]);
    }
    out.finish(doc, sheet.page);
  }
  const total = deferred.size;
  await input.onProgress?.(0, total);
  const { bytes } = await writePdfFile(doc, deferred, file, (done) => input.onProgress?.(done, total));
  return { bytes, notes };
}

/** The cover's layout across its sheet (mm from the back cover's trim left): back, spine, front — or mirrored for right-to-left books. */
export function coverLayout(spec: PageSpec, spineMm: number, direction: 'ltr' | 'rtl') {
  const back = direction === 'ltr' ? 0 : spec.trimW + spineMm;
  const front = direction === 'ltr' ? spec.trimW + spineMm : 0;
  const width = 2 * spec.trimW + spineMm;
  return { width, height: spec.trimH, back, front, spine: { x: spec.trimW, w: spineMm } };
}

/**
 * The cover of a perfect-bound book: one sheet, back + spine + front at the computed spine width,
 * with the bleed on its outer edges. Each side's scan is fitted to its own page and clipped to
 * its half of the sheet (the bleed on the outer edges, the spine's edge on the inner one).
 */
export async function coverPdf(
  sides: { front: PrintArt | null; back: PrintArt | null; spineMm: number; direction: 'ltr' | 'rtl' },
  input: PrintInput,
  file: string,
): Promise<{ bytes: number; notes: string[] }> {
  const { spec } = input;
  const { doc, font } = await document(`${input.title} cover`, input.proof);
  const deferred = new DeferredStreams(doc);
  const out = new ContentWriter();
  const notes: string[] = [];
  const slug = input.proof ? PROOF_SLUG_MM : 0;
  const layout = coverLayout(spec, sides.spineMm, sides.direction);
  const bleedH = layout.height + 2 * spec.bleed;
  const o = mmToPt(slug);
  const { sheet } = sheetPage(doc, { spec, out, opacity: new Opacities(doc), slug }, layout.width, layout.height);
  const side = (x: number, outerLeft: boolean): Rect =>
    outerLeft
      ? { x: x - spec.bleed, y: -spec.bleed, w: spec.trimW + spec.bleed, h: bleedH }
      : { x, y: -spec.bleed, w: spec.trimW + spec.bleed, h: bleedH };
  const placements: Placement[] = [];
  const backOuterLeft = layout.back === 0;
  if (sides.back)
    placements.push({ art: sides.back, trimLeft: layout.back, area: shift(side(0, backOuterLeft), layout.back), spec, label: 'Back cover' });
  if (sides.front)
    placements.push({ art: sides.front, trimLeft: layout.front, area: shift(side(0, !backOuterLeft), layout.front), spec, label: 'Front cover' });
  placeScans(deferred, sheet, placements, filler(input, notes, 'cover file'));
  // The spine's folds, as thin marks in the slug of a proof only (a print file carries nothing outside the art).
  if (font) {
    const x0 = sheet.at.x(layout.spine.x);
    const x1 = sheet.at.x(layout.spine.x + layout.spine.w);
    out.text(`q 0.75 0.1 0.1 RG 0.3 w ${pt(x0)} 0 m ${pt(x0)} ${pt(o)} l ${pt(x1)} 0 m ${pt(x1)} ${pt(o)} l S Q\n`);
    textAt(sheet, font, `${PROOF_MARK} · cover · spine ${sides.spineMm.toFixed(2)} mm`, 7, o, o / 2 - 2, [0.75, 0.1, 0.1]);
  }
  out.finish(doc, sheet.page);
  const total = deferred.size;
  await input.onProgress?.(0, total);
  const { bytes } = await writePdfFile(doc, deferred, file, (done) => input.onProgress?.(done, total));
  return { bytes, notes };
}

const shift = (r: Rect, dx: number): Rect => ({ ...r, x: r.x + dx });
