// PDFs for the printer and the drawing desk, drawn with pdf-lib from the same
// geometry and outlines as the editor. Fonts come from fonts/ and are embedded.
// The review dummy writes each page as one content stream of its own: pdf-lib's
// operators for its few shapes and texts, and the strokes' outlines as plain path
// operators in whole micrometres, deflated by node's zlib. pdf-lib keeps the
// document's structure, the font (subset once, at save) and the scans.
import fs from 'node:fs';
import path from 'node:path';
import { constants as zlibConstants, deflateSync } from 'node:zlib';
import fontkit from '@pdf-lib/fontkit';
import {
  PDFDocument,
  type PDFFont,
  PDFHexString,
  type PDFImage,
  PDFName,
  type PDFOperator,
  type PDFPage,
  type PDFRef,
  degrees,
  drawEllipse,
  drawImage,
  drawRectangle,
  rgb,
} from 'pdf-lib';
import { type PageSpec, type Rect, bleedBox, mmToPt, panelRects, safeBox } from '@/lib/print/geometry';
import { pdfBoxes } from '@/lib/print/book';
import { outlineOf, traceOutline } from '@/lib/strokes/outline';
import { type Lightbox, type Room, type Stroke, strokeAlpha } from '@/lib/strokes/types';
import { BEAT_KINDS, BEAT_LABELS } from '@/lib/gags/status';
import { sfntFromWoff } from './woff';

export const PRINTER_NOTE = "Guidance only: the printer's own specification takes precedence.";

const FONT_FILE = 'atkinson-hyperlegible-latin-400-normal.woff';
let fontBytes: Buffer | undefined;
/** The font as plain TrueType, unwrapped once per process (see woff.ts). */
const fontFile = () => (fontBytes ??= sfntFromWoff(fs.readFileSync(path.join(process.cwd(), 'fonts', FONT_FILE))));

async function newDoc(title: string) {
  const doc = await PDFDocument.create();
  doc.registerFontkit(fontkit);
  const font = await doc.embedFont(fontFile(), { subset: true });
  doc.setTitle(title);
  doc.setSubject(PRINTER_NOTE);
  doc.setCreator('Quadrille');
  doc.setProducer('Quadrille (pdf-lib)');
  return { doc, font };
}

const greyLevel = (g: number) => 1 - Math.min(100, Math.max(0, g)) / 100;

/** mm on the page (from the trim's top left) → pt in PDF space (origin bottom left). */
function placer(spec: PageSpec, pageH: number, originX = mmToPt(spec.bleed), originTop = mmToPt(spec.bleed)) {
  return {
    x: (mm: number) => originX + mmToPt(mm),
    y: (mm: number) => pageH - originTop - mmToPt(mm),
  };
}

/**
 * Stroke paths are written in whole micrometres from the trim's top left (the SVG
 * thumbnails round to the same 0.001 mm), with one `cm` mapping them to points, so
 * each coordinate is a short integer rather than a 17-digit decimal.
 */
const UM_PER_MM = 1000;

/** The graphics states (opacities) of one document: each registered once, named on the pages that use it. */
class Opacities {
  private refs = new Map<string, { name: PDFName; ref: PDFRef }>();
  constructor(private doc: PDFDocument) {}
  /** fill is `ca`, stroke `CA` (undefined leaves it opaque), as pdf-lib's own drawing does. */
  name(page: PDFPage, fill: number, stroke?: number): PDFName {
    const key = `${fill}/${stroke}`;
    let known = this.refs.get(key);
    if (!known) {
      const ref = this.doc.context.register(this.doc.context.obj({ Type: 'ExtGState', ca: fill, CA: stroke }));
      known = { name: PDFName.of(`QGS${this.refs.size}`), ref };
      this.refs.set(key, known);
    }
    page.node.setExtGState(known.name, known.ref);
    return known.name;
  }
}

/**
 * A page's content stream as bytes. Path coordinates are written digit by digit:
 * a page of 40 strokes holds some 20,000 of them, and building them as strings
 * (or as pdf-lib operator objects) cost more than everything else on the page.
 */
export class ContentWriter {
  private buf = new Uint8Array(1 << 16);
  private n = 0;
  /** Room for a path segment: four coordinates (sign, up to ten digits and a space each) and an operator. */
  private static SEGMENT = 4 * 12 + 2;

  private room(k: number) {
    if (this.n + k <= this.buf.length) return;
    const grown = new Uint8Array(Math.max(this.buf.length * 2, this.n + k));
    grown.set(this.buf.subarray(0, this.n));
    this.buf = grown;
  }

  /** ASCII text, e.g. pdf-lib operators' own serialisation. */
  text(s: string) {
    this.room(s.length);
    for (let i = 0; i < s.length; i++) this.buf[this.n++] = s.charCodeAt(i) & 0xff;
  }

  ops(ops: (PDFOperator | undefined | false)[]) {
    for (const op of ops) if (op) this.text(`${op.toString()}\n`);
  }

  /** v rounded to an integer, then a space. */
  private int(v: number) {
    let i = Math.round(v);
    if (!(i > -2e9 && i < 2e9)) i = 0; // NaN, or kilometres off a page whose points are validated to within a metre
    const buf = this.buf;
    if (i < 0) {
      buf[this.n++] = 45; // -
      i = -i;
    }
    const len = i < 10 ? 1 : i < 100 ? 2 : i < 1000 ? 3 : i < 10000 ? 4 : i < 100000 ? 5 : i < 1000000 ? 6 : String(i).length;
    let at = this.n + len;
    this.n = at + 1;
    buf[at] = 32;
    do {
      const q = (i / 10) | 0;
      buf[--at] = 48 + i - q * 10;
      i = q;
    } while (i > 0);
  }

  moveTo(x: number, y: number) {
    this.room(ContentWriter.SEGMENT);
    this.int(x);
    this.int(y);
    this.buf[this.n++] = 109; // m
    this.buf[this.n++] = 10;
  }

  /** pdf-lib's appendQuadraticCurve: `v` takes the current point as its first control point. */
  curveV(cx: number, cy: number, x: number, y: number) {
    this.room(ContentWriter.SEGMENT);
    this.int(cx);
    this.int(cy);
    this.int(x);
    this.int(y);
    this.buf[this.n++] = 118; // v
    this.buf[this.n++] = 10;
  }

  /** Deflated for a FlateDecode stream. Huffman coding alone: path digits have few repeats for LZ77 to find (1 % smaller at 2.5× the time). */
  deflated(): Buffer {
    return deflateSync(this.buf.subarray(0, this.n), { level: 1, strategy: zlibConstants.Z_HUFFMAN_ONLY });
  }

  /** Sets what was written as the page's content stream, and starts again (the buffer is kept for the next page). */
  finish(doc: PDFDocument, page: PDFPage) {
    page.node.addContentStream(doc.context.register(doc.context.stream(this.deflated(), { Filter: 'FlateDecode' })));
    this.n = 0;
  }
}

/**
 * Strokes as filled outlines, in µm from the trim's top left (the caller sets the `cm`):
 * the same curve as the canvas and the SVG (traceOutline of outlineOf).
 */
export function writeStrokePaths(out: ContentWriter, strokes: Stroke[], toneState: (alpha: number) => PDFName) {
  const path = {
    moveTo: (x: number, y: number) => out.moveTo(x * UM_PER_MM, y * UM_PER_MM),
    quadraticCurveTo: (cx: number, cy: number, x: number, y: number) => out.curveV(cx * UM_PER_MM, cy * UM_PER_MM, x * UM_PER_MM, y * UM_PER_MM),
    closePath: () => out.text('h\n'),
  };
  for (const s of strokes) {
    const alpha = strokeAlpha(s.tool);
    const v = Math.round(greyLevel(s.grey) * 1000) / 1000; // never an exponent, which PDF numbers lack
    out.text(alpha < 1 ? `q ${toneState(alpha).toString()} gs ${v} ${v} ${v} rg\n` : `q ${v} ${v} ${v} rg\n`);
    traceOutline(path, outlineOf(s));
    out.text('f Q\n');
  }
}

/** A length or position in points, to 0.001 pt, never with an exponent (which PDF numbers lack). */
const pt = (v: number) => String(Math.round(v * 1000) / 1000);

/** The `cm` that maps µm from the trim's top left to the page's points. */
export function strokeSpace(spec: PageSpec, pageH: number): string {
  const k = mmToPt(1) / UM_PER_MM; // 0.00283…: written in full, as a scale
  const at = placer(spec, pageH);
  return `${k} 0 0 ${-k} ${pt(at.x(0))} ${pt(at.y(0))} cm\n`;
}

/** A rectangle's path as pdf-lib's drawRectangle makes it: from the lower-left corner, up first. */
const rectPath = (x: number, y: number, w: number, h: number) =>
  `${pt(x)} ${pt(y)} m ${pt(x)} ${pt(y + h)} l ${pt(x + w)} ${pt(y + h)} l ${pt(x + w)} ${pt(y)} l h`;

/** The drawing context of one review page. */
type Sheet = { page: PDFPage; out: ContentWriter; opacity: Opacities; at: ReturnType<typeof placer> };

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

type PlacedScan = { lightbox: Lightbox; image: { name: PDFName; image: PDFImage } };

/** pdf-lib's drawRectangle operators, with page.drawRectangle's defaults. */
const box = (o: Partial<Parameters<typeof drawRectangle>[0]> & { x: number; y: number; width: number; height: number }) =>
  drawRectangle({ rotate: degrees(0), xSkew: degrees(0), ySkew: degrees(0), color: undefined, borderColor: undefined, borderWidth: 0, ...o });

const ROOM_LOOK = { color: rgb(0.86, 0.91, 0.94), borderColor: rgb(0.11, 0.31, 0.43), borderWidth: 0.4, borderDashArray: [2, 1.5] };

/** The panels: each clipped, with its scans, rooms and strokes in that order, then its border. */
function drawPanels(sheet: Sheet, spec: PageSpec, strokes: Stroke[], rooms: Room[], scans: PlacedScan[]) {
  const { at, out, page } = sheet;
  const { height } = page.getSize();
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
      out.text(`q ${strokeSpace(spec, height)}`);
      writeStrokePaths(out, inPanel, toneState);
      out.text('Q\n');
    }
    out.text('Q\n');
    out.text(`q 0.55 0.54 0.51 RG 0.5 w ${rectPath(at.x(r.x), at.y(r.y + r.h), mmToPt(r.w), mmToPt(r.h))} S Q\n`);
  });
}

const FONT_KEY = PDFName.of('QF0');
/** An RGB fill for text, each 0…1. */
type Grey3 = [number, number, number];

/** One line of text, or the font's encoding of it. */
function textAt(sheet: Sheet, font: PDFFont, text: string | PDFHexString, size: number, x: number, y: number, color: Grey3) {
  sheet.page.node.setFontDictionary(FONT_KEY, font.ref);
  const glyphs = typeof text === 'string' ? font.encodeText(text) : text;
  const [r, g, b] = color;
  sheet.out.text(`q BT ${r} ${g} ${b} rg ${FONT_KEY.toString()} ${size} Tf 1 0 0 1 ${pt(x)} ${pt(y)} Tm ${glyphs.toString()} Tj ET Q\n`);
}

function centred(sheet: Sheet, font: PDFFont, text: string, size: number, cx: number, y: number, color: Grey3 = [0.16, 0.16, 0.18]) {
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
