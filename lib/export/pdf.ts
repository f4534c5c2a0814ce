// PDFs for the printer and the drawing desk, drawn with pdf-lib from the same
// geometry and outlines as the editor. Fonts come from fonts/ and are embedded.
import fs from 'node:fs';
import path from 'node:path';
import fontkit from '@pdf-lib/fontkit';
import {
  PDFDocument,
  type PDFFont,
  type PDFImage,
  PDFName,
  degrees,
  type PDFOperator,
  type PDFPage,
  appendQuadraticCurve,
  clip,
  closePath,
  endPath,
  fill,
  moveTo,
  popGraphicsState,
  pushGraphicsState,
  rectangle,
  rgb,
  setFillingRgbColor,
  setGraphicsState,
} from 'pdf-lib';
import { type PageSpec, type Rect, bleedBox, mmToPt, panelRects, safeBox } from '@/lib/print/geometry';
import { pdfBoxes } from '@/lib/print/book';
import { outlineOf, traceOutline } from '@/lib/strokes/outline';
import { type Lightbox, type Room, type Stroke, strokeAlpha } from '@/lib/strokes/types';
import { BEAT_KINDS, BEAT_LABELS } from '@/lib/gags/status';

export const PRINTER_NOTE = "Guidance only: the printer's own specification takes precedence.";

const FONT_FILE = 'atkinson-hyperlegible-latin-400-normal.woff';

async function newDoc(title: string) {
  const doc = await PDFDocument.create();
  doc.registerFontkit(fontkit);
  const font = await doc.embedFont(fs.readFileSync(path.join(process.cwd(), 'fonts', FONT_FILE)), { subset: true });
  doc.setTitle(title);
  doc.setSubject(PRINTER_NOTE);
  doc.setCreator('Quadrille');
  doc.setProducer('Quadrille (pdf-lib)');
  return { doc, font };
}

const greyLevel = (g: number) => 1 - Math.min(100, Math.max(0, g)) / 100;

/** A graphics state for translucent tone, registered once per page. */
function toneState(page: PDFPage, alpha: number): PDFName {
  const name = PDFName.of(`QTone${Math.round(alpha * 100)}`);
  const ref = page.doc.context.register(page.doc.context.obj({ Type: 'ExtGState', ca: alpha, CA: alpha }));
  page.node.setExtGState(name, ref);
  return name;
}

/** mm on the page (from the trim's top left) → pt in PDF space (origin bottom left). */
function placer(spec: PageSpec, pageH: number, originX = mmToPt(spec.bleed), originTop = mmToPt(spec.bleed)) {
  return {
    x: (mm: number) => originX + mmToPt(mm),
    y: (mm: number) => pageH - originTop - mmToPt(mm),
  };
}

/** A scan under the strokes, clipped to its panel or the page; its quarter turn is clockwise as on screen. */
function drawLightbox(page: PDFPage, at: ReturnType<typeof placer>, area: Rect, l: Lightbox, image: PDFImage) {
  const turnedQ = l.rotation === 90 || l.rotation === 270;
  const iw = mmToPt(turnedQ ? l.h : l.w);
  const ih = mmToPt(turnedQ ? l.w : l.h);
  const cx = at.x(l.x + l.w / 2);
  const cy = at.y(l.y + l.h / 2);
  // pdf-lib turns about the image's lower-left corner, counter-clockwise: place that corner so the centre lands on (cx, cy).
  const phi = (-l.rotation * Math.PI) / 180;
  const x = cx - ((iw / 2) * Math.cos(phi) - (ih / 2) * Math.sin(phi));
  const y = cy - ((iw / 2) * Math.sin(phi) + (ih / 2) * Math.cos(phi));
  page.pushOperators(pushGraphicsState(), rectangle(at.x(area.x), at.y(area.y + area.h), mmToPt(area.w), mmToPt(area.h)), clip(), endPath());
  page.drawImage(image, { x, y, width: iw, height: ih, rotate: degrees(-l.rotation), opacity: l.opacity });
  page.pushOperators(popGraphicsState());
}

type PlacedScan = { lightbox: Lightbox; image: PDFImage };

function drawStrokes(page: PDFPage, spec: PageSpec, strokes: Stroke[], rooms: Room[], scans: PlacedScan[] = []) {
  const { height } = page.getSize();
  const at = placer(spec, height);
  const panels = panelRects(spec);
  let tone: PDFName | undefined;
  for (const s of scans.filter((x) => x.lightbox.panel === null)) drawLightbox(page, at, bleedBox(spec), s.lightbox, s.image);
  panels.forEach((r, i) => {
    page.pushOperators(pushGraphicsState(), rectangle(at.x(r.x), at.y(r.y + r.h), mmToPt(r.w), mmToPt(r.h)), clip(), endPath());
    for (const s of scans.filter((x) => x.lightbox.panel === i)) drawLightbox(page, at, r, s.lightbox, s.image);
    for (const room of rooms.filter((x) => x.panel === i)) {
      const common = { color: rgb(0.86, 0.91, 0.94), opacity: 0.6, borderColor: rgb(0.11, 0.31, 0.43), borderWidth: 0.4, borderDashArray: [2, 1.5] };
      if (room.shape === 'ellipse')
        page.drawEllipse({
          x: at.x(room.x + room.w / 2),
          y: at.y(room.y + room.h / 2),
          xScale: mmToPt(room.w / 2),
          yScale: mmToPt(room.h / 2),
          ...common,
        });
      else page.drawRectangle({ x: at.x(room.x), y: at.y(room.y + room.h), width: mmToPt(room.w), height: mmToPt(room.h), ...common });
    }
    // Each outline is written as PDF path operators (the same curve as the canvas and the SVG).
    for (const s of strokes.filter((x) => x.panel === i)) {
      const ops: PDFOperator[] = [pushGraphicsState()];
      const alpha = strokeAlpha(s.tool);
      if (alpha < 1) ops.push(setGraphicsState(tone ?? (tone = toneState(page, alpha))));
      const v = greyLevel(s.grey);
      ops.push(setFillingRgbColor(v, v, v));
      traceOutline(
        {
          moveTo: (x, y) => ops.push(moveTo(at.x(x), at.y(y))),
          quadraticCurveTo: (cx, cy, x, y) => ops.push(appendQuadraticCurve(at.x(cx), at.y(cy), at.x(x), at.y(y))),
          closePath: () => ops.push(closePath()),
        },
        outlineOf(s),
      );
      ops.push(fill(), popGraphicsState());
      page.pushOperators(...ops);
    }
    page.pushOperators(popGraphicsState());
    page.drawRectangle({
      x: at.x(r.x),
      y: at.y(r.y + r.h),
      width: mmToPt(r.w),
      height: mmToPt(r.h),
      borderColor: rgb(0.55, 0.54, 0.51),
      borderWidth: 0.5,
    });
  });
}

function centred(page: PDFPage, font: PDFFont, text: string, size: number, cx: number, y: number, color = rgb(0.16, 0.16, 0.18)) {
  page.drawText(text, { x: cx - font.widthOfTextAtSize(text, size) / 2, y, size, font, color });
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
  // Each scan is embedded once, however many pages place it.
  const embedded = new Map<string, PDFImage>();
  const scanFor = async (uploadId: string) => {
    const known = embedded.get(uploadId);
    if (known) return known;
    const src = opts.scans?.get(uploadId);
    if (!src) return null;
    const image = src.format === 'png' ? await doc.embedPng(src.bytes) : await doc.embedJpg(src.bytes);
    embedded.set(uploadId, image);
    return image;
  };
  const boxes = pdfBoxes(spec);
  const [, , w, h] = boxes.media;
  for (const p of pages) {
    const page = doc.addPage([w, h]);
    page.setMediaBox(0, 0, w, h);
    page.setBleedBox(boxes.bleed[0], boxes.bleed[1], boxes.bleed[2] - boxes.bleed[0], boxes.bleed[3] - boxes.bleed[1]);
    page.setTrimBox(boxes.trim[0], boxes.trim[1], boxes.trim[2] - boxes.trim[0], boxes.trim[3] - boxes.trim[1]);
    page.drawRectangle({ x: 0, y: 0, width: w, height: h, color: rgb(1, 1, 1) });
    if (p.kind === 'gag') {
      const scans: PlacedScan[] = [];
      for (const l of p.lightboxes ?? []) {
        const image = l.visible ? await scanFor(l.uploadId) : null;
        if (image) scans.push({ lightbox: l, image });
      }
      drawStrokes(page, spec, p.strokes ?? [], p.rooms ?? [], scans);
    } else centred(page, font, p.label, 14, w / 2, h / 2, rgb(0.47, 0.46, 0.49));
    const safe = safeBox(spec);
    centred(page, font, String(p.number), 7, w / 2, boxes.trim[1] + mmToPt(safe.y) / 2 - 2.5);
    // In the bleed, outside the trim: the page's name and the printer note (cut off when trimmed).
    page.drawText(`${p.number} · ${p.kind === 'gag' ? p.label : p.label} · ${PRINTER_NOTE}`, {
      x: 2,
      y: 2,
      size: 4,
      font,
      color: rgb(0.5, 0.5, 0.5),
    });
    opts.onPage?.(p.number);
  }
  return doc.save();
}

export const PAPERS = { A4: { w: 210, h: 297 }, A3: { w: 297, h: 420 } } as const; // ISO 216
export type Paper = keyof typeof PAPERS;

/** Does the page at this scale, with room for crop marks, fit the paper? */
export function templateFits(spec: PageSpec, scale: number, paper: Paper): boolean {
  const margin = 12; // crop marks and the scale bar
  const w = (spec.trimW + 2 * spec.bleed) * scale + 2 * margin;
  const h = (spec.trimH + 2 * spec.bleed) * scale + 2 * margin + 10;
  return w <= PAPERS[paper].w && h <= PAPERS[paper].h;
}

/** Drawing templates: blank pages with bleed, trim, safe and panel guides at a scale, crop marks and a 10 mm bar. */
export async function templatesPdf(
  spec: PageSpec,
  title: string,
  gags: { title: string; notes: string[] }[],
  scale: number,
  paper: Paper,
): Promise<Uint8Array> {
  const { doc, font } = await newDoc(`${title} — drawing templates ${Math.round(scale * 100)}% on ${paper}`);
  const pw = mmToPt(PAPERS[paper].w);
  const ph = mmToPt(PAPERS[paper].h);
  const S = (mm: number) => mmToPt(mm * scale);
  const fullW = spec.trimW + 2 * spec.bleed;
  const fullH = spec.trimH + 2 * spec.bleed;
  const ox = (pw - S(fullW)) / 2; // left edge of the bleed box
  const oyTop = (ph - S(fullH)) / 2 + mmToPt(4); // top edge of the bleed box, from the top
  const X = (mm: number) => ox + S(mm + spec.bleed);
  const Y = (mm: number) => ph - oyTop - S(mm + spec.bleed);
  for (const g of gags.length ? gags : [{ title: '', notes: [] }]) {
    const page = doc.addPage([pw, ph]);
    const thin = { borderWidth: 0.35 };
    page.drawRectangle({
      x: X(-spec.bleed),
      y: Y(spec.trimH + spec.bleed),
      width: S(fullW),
      height: S(fullH),
      borderColor: rgb(0.72, 0.2, 0.12),
      borderDashArray: [3, 2],
      ...thin,
    });
    page.drawRectangle({ x: X(0), y: Y(spec.trimH), width: S(spec.trimW), height: S(spec.trimH), borderColor: rgb(0.16, 0.16, 0.18), ...thin });
    const safe = safeBox(spec);
    page.drawRectangle({
      x: X(safe.x),
      y: Y(safe.y + safe.h),
      width: S(safe.w),
      height: S(safe.h),
      borderColor: rgb(0.11, 0.31, 0.43),
      borderDashArray: [2, 2],
      ...thin,
    });
    panelRects(spec).forEach((r, i) => {
      page.drawRectangle({ x: X(r.x), y: Y(r.y + r.h), width: S(r.w), height: S(r.h), borderColor: rgb(0.55, 0.54, 0.51), borderWidth: 0.6 });
      page.drawText(`${i + 1} ${BEAT_LABELS[BEAT_KINDS[i]!]}`, { x: X(r.x) + 3, y: Y(r.y) - 9, size: 7, font, color: rgb(0.6, 0.6, 0.62) });
    });
    // Crop marks at the trim corners, starting outside the bleed.
    const gap = S(spec.bleed) + mmToPt(1);
    const len = mmToPt(5);
    for (const [cx, cy, sx, sy] of [
      [X(0), Y(0), -1, 1],
      [X(spec.trimW), Y(0), 1, 1],
      [X(0), Y(spec.trimH), -1, -1],
      [X(spec.trimW), Y(spec.trimH), 1, -1],
    ] as const) {
      page.drawLine({ start: { x: cx + sx * gap, y: cy }, end: { x: cx + sx * (gap + len), y: cy }, thickness: 0.3 });
      page.drawLine({ start: { x: cx, y: cy + sy * gap }, end: { x: cx, y: cy + sy * (gap + len) }, thickness: 0.3 });
    }
    // A 10 mm scale bar, drawn at the template's scale.
    const barY = Y(spec.trimH + spec.bleed) - mmToPt(9);
    page.drawRectangle({ x: X(0), y: barY, width: S(10), height: mmToPt(1.5), color: rgb(0.16, 0.16, 0.18) });
    page.drawText(`10 mm at ${Math.round(scale * 100)}%`, { x: X(0) + S(10) + 4, y: barY, size: 7, font });
    page.drawText(`${g.title}`.slice(0, 80), { x: X(0), y: ph - mmToPt(8), size: 9, font });
    page.drawText(PRINTER_NOTE, { x: X(0), y: mmToPt(6), size: 6, font, color: rgb(0.45, 0.45, 0.47) });
  }
  return doc.save();
}
