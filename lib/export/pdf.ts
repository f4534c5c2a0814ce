// The review dummy for the printer, drawn with pdf-lib from the same geometry and
// outlines as the editor. Each page is one content stream of its own: pdf-lib's
// operators for its few shapes and texts, and the strokes' outlines as plain path
// operators in whole micrometres, deflated by node's zlib (pdf-content.ts). pdf-lib
// keeps the document's structure, the font (subset once, at save) and the scans.
// The drawing desk's blue-line sheets are in blue-lines.ts.
import { type PDFFont, PDFHexString, type PDFImage, PDFName, type PDFPage, degrees, drawEllipse, drawImage, drawRectangle, rgb } from 'pdf-lib';
import { type PageSpec, type Rect, bleedBox, mmToPt, panelRects } from '@/lib/print/geometry';
import { pdfBoxes } from '@/lib/print/book';
import type { Lightbox, Room, Stroke } from '@/lib/strokes/types';
import {
  ContentWriter,
  FONT_KEY,
  Opacities,
  PRINTER_NOTE,
  type Rgb,
  newDoc,
  pt,
  rectPath,
  strokeSpaceAt,
  textOps,
  writeStrokePaths,
} from './pdf-content';

export { ContentWriter, PRINTER_NOTE, writeStrokePaths };

/** mm on the page (from the trim's top left) → pt in PDF space (origin bottom left). */
export function placer(spec: PageSpec, pageH: number, originX = mmToPt(spec.bleed), originTop = mmToPt(spec.bleed)) {
  return {
    x: (mm: number) => originX + mmToPt(mm),
    y: (mm: number) => pageH - originTop - mmToPt(mm),
  };
}

/** The `cm` that maps µm from the trim's top left to the review page's points. */
export function strokeSpace(spec: PageSpec, pageH: number): string {
  const at = placer(spec, pageH);
  return strokeSpaceAt(at.x(0), at.y(0));
}

/** The drawing context of one review page. */
export type Sheet = { page: PDFPage; out: ContentWriter; opacity: Opacities; at: ReturnType<typeof placer> };

/** Saves the state and clips to an area in mm (a `Q` ends it). */
const clipTo = (at: ReturnType<typeof placer>, r: Rect) => `q ${pt(at.x(r.x))} ${pt(at.y(r.y + r.h))} ${pt(mmToPt(r.w))} ${pt(mmToPt(r.h))} re W n\n`;

/** A scan under the strokes, clipped to its panel or the page; its quarter turn is clockwise as on screen. */
function drawLightbox(sheet: Sheet, area: Rect, l: Lightbox, image: { name: PDFName; image: PDFImage }) {
  const { at, out } = sheet;
  const turnedQ = l.rotation === 90 || l.rotation === 270;
  const iw = mmToPt(turnedQ ? l.h : l.w);
  const ih = mmToPt(turnedQ ? l.w : l.h);
  const cx = at.x(l.x + l.w / 2);
  const cy = at.y(l.y + l.h / 2);
  // pdf-lib turns about the image's lower-left corner, counter-clockwise: place that corner so the centre lands on (cx, cy).
  const phi = (-l.rotation * Math.PI) / 180;
  const x = cx - ((iw / 2) * Math.cos(phi) - (ih / 2) * Math.sin(phi));
  const y = cy - ((iw / 2) * Math.sin(phi) + (ih / 2) * Math.cos(phi));
  sheet.page.node.setXObject(image.name, image.image.ref);
  out.text(clipTo(at, area));
  out.ops(
    drawImage(image.name, {
      x,
      y,
      width: iw,
      height: ih,
      rotate: degrees(-l.rotation),
      xSkew: degrees(0),
      ySkew: degrees(0),
      graphicsState: sheet.opacity.name(sheet.page, l.opacity),
    }),
  );
  out.text('Q\n');
}

export type PlacedScan = { lightbox: Lightbox; image: { name: PDFName; image: PDFImage } };

/** pdf-lib's drawRectangle operators, with page.drawRectangle's defaults. */
const box = (o: Partial<Parameters<typeof drawRectangle>[0]> & { x: number; y: number; width: number; height: number }) =>
  drawRectangle({ rotate: degrees(0), xSkew: degrees(0), ySkew: degrees(0), color: undefined, borderColor: undefined, borderWidth: 0, ...o });

const ROOM_LOOK = { color: rgb(0.86, 0.91, 0.94), borderColor: rgb(0.11, 0.31, 0.43), borderWidth: 0.4, borderDashArray: [2, 1.5] };

/** The panels: each clipped, with its scans, rooms and strokes in that order, then its border. */
export function drawPanels(sheet: Sheet, spec: PageSpec, strokes: Stroke[], rooms: Room[], scans: PlacedScan[]) {
  const { at, out, page } = sheet;
  const toneState = (alpha: number) => sheet.opacity.name(page, alpha, alpha);
  for (const s of scans.filter((x) => x.lightbox.panel === null)) drawLightbox(sheet, bleedBox(spec), s.lightbox, s.image);
  panelRects(spec).forEach((r, i) => {
    out.text(clipTo(at, r));
    for (const s of scans.filter((x) => x.lightbox.panel === i)) drawLightbox(sheet, r, s.lightbox, s.image);
    for (const room of rooms.filter((x) => x.panel === i)) {
      const look = { ...ROOM_LOOK, graphicsState: sheet.opacity.name(page, 0.6) };
      out.ops(
        room.shape === 'ellipse'
          ? drawEllipse({
              x: at.x(room.x + room.w / 2),
              y: at.y(room.y + room.h / 2),
              xScale: mmToPt(room.w / 2),
              yScale: mmToPt(room.h / 2),
              ...look,
            })
          : box({ x: at.x(room.x), y: at.y(room.y + room.h), width: mmToPt(room.w), height: mmToPt(room.h), ...look }),
      );
    }
    const inPanel = strokes.filter((x) => x.panel === i);
    if (inPanel.length) {
      out.text(`q ${strokeSpaceAt(at.x(0), at.y(0))}`);
      writeStrokePaths(out, inPanel, toneState);
      out.text('Q\n');
    }
    out.text('Q\n');
    out.text(`q 0.55 0.54 0.51 RG 0.5 w ${rectPath(at.x(r.x), at.y(r.y + r.h), mmToPt(r.w), mmToPt(r.h))} S Q\n`);
  });
}

/** One line of text, or the font's encoding of it. */
export function textAt(sheet: Sheet, font: PDFFont, text: string | PDFHexString, size: number, x: number, y: number, color: Rgb) {
  sheet.page.node.setFontDictionary(FONT_KEY, font.ref);
  sheet.out.text(textOps(font, text, size, x, y, color));
}

export function centred(sheet: Sheet, font: PDFFont, text: string, size: number, cx: number, y: number, color: Rgb = [0.16, 0.16, 0.18]) {
  textAt(sheet, font, text, size, cx - font.widthOfTextAtSize(text, size) / 2, y, color);
}

/**
 * The page number, inside the safe area (nothing within the safe margin of the trim risks the knife): its glyphs sit
 * 1 mm above the safe box's bottom edge, centred, on a white label so it reads over the art of the bottom panels.
 */
function pageNumber(sheet: Sheet, font: PDFFont, n: number, cx: number, safeBottom: number) {
  const size = 7;
  const text = String(n);
  const width = font.widthOfTextAtSize(text, size);
  const baseline = safeBottom + mmToPt(1) + font.heightAtSize(size, { descender: true }) - font.heightAtSize(size, { descender: false });
  const top = safeBottom + mmToPt(1) + font.heightAtSize(size, { descender: true });
  sheet.out.text(`q 1 1 1 rg ${rectPath(cx - width / 2 - 1, safeBottom + mmToPt(0.5), width + 2, top - safeBottom - mmToPt(0.5) + 0.5)} f Q\n`);
  textAt(sheet, font, text, size, cx - width / 2, baseline, [0.16, 0.16, 0.18]);
}

/**
 * The slug line's size and baseline so that its whole glyph box (ascender to descender) lies in the bleed below the
 * trim with a fifth of the bleed to spare on each side: at most 4 pt, and left off the page (the note stays in the
 * document's Subject) when the bleed is too narrow for 2 pt text — a slug inside the trim would be printed.
 */
export function slugFit(font: PDFFont, bleedPt: number): { size: number; y: number } | null {
  const perPt = font.heightAtSize(1, { descender: true });
  const size = Math.min(4, (bleedPt * 0.6) / perPt);
  if (size < 2) return null;
  const descent = perPt * size - font.heightAtSize(size, { descender: false });
  return { size, y: (bleedPt - perPt * size) / 2 + descent };
}

/** A scan's bytes for the PDF: PNG or JPEG (pdf-lib embeds no other kind). */
export type ScanImage = { bytes: Uint8Array; format: 'png' | 'jpg' };

export type ReviewPage = {
  number: number;
  kind: string;
  label: string;
  strokes?: Stroke[];
  rooms?: Room[];
  /** Visible lightboxes to draw under the strokes (the "with lightbox" option). */
  lightboxes?: Lightbox[];
};

/** The review dummy: every page in running order at trim plus bleed, TrimBox and BleedBox set. */
export async function reviewPdf(
  spec: PageSpec,
  title: string,
  pages: ReviewPage[],
  opts: { scans?: Map<string, ScanImage>; onPage?: (done: number) => void } = {},
): Promise<Uint8Array> {
  const { doc, font } = await newDoc(`${title} — review dummy`);
  const opacity = new Opacities(doc);
  // Each scan is embedded once, however many pages place it.
  const embedded = new Map<string, { name: PDFName; image: PDFImage }>();
  const scanFor = async (uploadId: string) => {
    const known = embedded.get(uploadId);
    if (known) return known;
    const src = opts.scans?.get(uploadId);
    if (!src) return null;
    const image = src.format === 'png' ? await doc.embedPng(src.bytes) : await doc.embedJpg(src.bytes);
    const placed = { name: PDFName.of(`QIm${embedded.size}`), image };
    embedded.set(uploadId, placed);
    return placed;
  };
  const boxes = pdfBoxes(spec);
  const [, , w, h] = boxes.media;
  const out = new ContentWriter();
  // The note is the same on every page: laid out once (a space before it, so no glyph joins across).
  const note = font.encodeText(PRINTER_NOTE).asString();
  for (const p of pages) {
    const page = doc.addPage([w, h]);
    page.setMediaBox(0, 0, w, h);
    page.setBleedBox(boxes.bleed[0], boxes.bleed[1], boxes.bleed[2] - boxes.bleed[0], boxes.bleed[3] - boxes.bleed[1]);
    page.setTrimBox(boxes.trim[0], boxes.trim[1], boxes.trim[2] - boxes.trim[0], boxes.trim[3] - boxes.trim[1]);
    const sheet: Sheet = { page, out, opacity, at: placer(spec, h) };
    sheet.out.text(`q 1 1 1 rg ${rectPath(0, 0, w, h)} f Q\n`);
    if (p.kind === 'gag') {
      const scans: PlacedScan[] = [];
      for (const l of p.lightboxes ?? []) {
        const image = l.visible ? await scanFor(l.uploadId) : null;
        if (image) scans.push({ lightbox: l, image });
      }
      drawPanels(sheet, spec, p.strokes ?? [], p.rooms ?? [], scans);
    } else centred(sheet, font, p.label, 14, w / 2, h / 2, [0.47, 0.46, 0.49]);
    pageNumber(sheet, font, p.number, w / 2, boxes.safe[1]);
    // In the bleed, outside the trim: the page's name and the printer note (cut off when trimmed).
    const slug = slugFit(font, boxes.trim[1]);
    if (slug)
      textAt(sheet, font, PDFHexString.of(font.encodeText(`${p.number} · ${p.label} · `).asString() + note), slug.size, 2, slug.y, [0.5, 0.5, 0.5]);
    sheet.out.finish(doc, page);
    opts.onPage?.(p.number);
  }
  return doc.save();
}
