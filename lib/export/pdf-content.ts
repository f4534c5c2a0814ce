// What the PDFs share: the document with its embedded font, the content-stream
// writer, the graphics states, and the strokes' outlines as path operators. Every
// PDF draws the same outlines as the editor and the thumbnails (lib/strokes/outline).
import { randomInt } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { constants as zlibConstants, deflateSync } from 'node:zlib';
import fontkit from '@pdf-lib/fontkit';
import { PDFDocument, type PDFFont, PDFHexString, PDFName, type PDFOperator, type PDFPage, type PDFRef } from 'pdf-lib';
import { type Outline, outlineOf, traceOutline } from '@/lib/strokes/outline';
import { type Stroke, strokeAlpha } from '@/lib/strokes/types';
import { sfntFromWoff } from './woff';

export const PRINTER_NOTE = "Guidance only: the printer's own specification takes precedence.";

const FONT_FILE = 'atkinson-hyperlegible-latin-400-normal.woff';
let fontBytes: Buffer | undefined;
/** The font as plain TrueType, unwrapped once per process (see woff.ts). */
const fontFile = () => (fontBytes ??= sfntFromWoff(fs.readFileSync(path.join(process.cwd(), 'fonts', FONT_FILE))));
let fontName: string | undefined;

/**
 * The embedded subset's name: six capital letters, '+', the font's PostScript name, as ISO 32000-1 §9.6.4 asks of a
 * font subset (pdf-lib subsets but names it without the tag, so preflight tools and `pdffonts` took it for the whole
 * font). Random per document, so subsets from different files never share a name in an imposition that merges them.
 */
function subsetName(): string {
  fontName ??= fontkit.create(fontFile()).postscriptName || 'Font';
  const tag = Array.from({ length: 6 }, () => String.fromCharCode(65 + randomInt(26))).join('');
  return `${tag}+${fontName}`;
}

export async function newDoc(title: string): Promise<{ doc: PDFDocument; font: PDFFont }>;
/** `font: false`: a document with no text (the print file), so with no font embedded. */
export async function newDoc(title: string, opts: { font: false }): Promise<{ doc: PDFDocument; font: null }>;
export async function newDoc(title: string, opts: { font?: boolean } = {}): Promise<{ doc: PDFDocument; font: PDFFont | null }> {
  const doc = await PDFDocument.create();
  let font: PDFFont | null = null;
  if (opts.font !== false) {
    doc.registerFontkit(fontkit);
    font = await doc.embedFont(fontFile(), { subset: true, customName: subsetName() });
  }
  doc.setTitle(title);
  doc.setSubject(PRINTER_NOTE);
  doc.setCreator('Quadrille');
  doc.setProducer('Quadrille (pdf-lib)');
  return { doc, font };
}

export const greyLevel = (g: number) => 1 - Math.min(100, Math.max(0, g)) / 100;

/**
 * Stroke paths are written in whole micrometres from the trim's top left (the SVG
 * thumbnails round to the same 0.001 mm), with one `cm` mapping them to points, so
 * each coordinate is a short integer rather than a 17-digit decimal.
 */
export const UM_PER_MM = 1000;

/** The graphics states (opacities) of one document: each registered once, named on the pages that use it. */
export class Opacities {
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
  /** Room for a path segment: two coordinates (sign, up to ten digits and a space each) and an operator. */
  private static SEGMENT = 2 * 12 + 2;

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

  lineTo(x: number, y: number) {
    this.room(ContentWriter.SEGMENT);
    this.int(x);
    this.int(y);
    this.buf[this.n++] = 108; // l
    this.buf[this.n++] = 10;
  }

  /** Deflated for a FlateDecode stream. Huffman coding alone: path digits have few repeats for LZ77 to find (1 % smaller at 2.5× the time). */
  deflated(): Buffer {
    return deflateSync(this.buf.subarray(0, this.n), { level: 1, strategy: zlibConstants.Z_HUFFMAN_ONLY });
  }

  /** Starts again, keeping the buffer. */
  reset() {
    this.n = 0;
  }

  /** Sets what was written as the page's content stream, and starts again (the buffer is kept for the next page). */
  finish(doc: PDFDocument, page: PDFPage) {
    page.node.addContentStream(doc.context.register(doc.context.stream(this.deflated(), { Filter: 'FlateDecode' })));
    this.n = 0;
  }
}

/** One outline's path, in µm from the trim's top left (the caller sets the `cm` and fills it by the non-zero rule, `f`). */
export function writeOutline(out: ContentWriter, outline: Outline) {
  traceOutline(
    {
      moveTo: (x: number, y: number) => out.moveTo(x * UM_PER_MM, y * UM_PER_MM),
      lineTo: (x: number, y: number) => out.lineTo(x * UM_PER_MM, y * UM_PER_MM),
      closePath: () => out.text('h\n'),
    },
    outline,
  );
}

/**
 * Strokes as filled outlines in their grey, in µm from the trim's top left (the caller sets
 * the `cm`): the same polygons as the canvas and the SVG (traceOutline of outlineOf).
 */
export function writeStrokePaths(out: ContentWriter, strokes: Stroke[], toneState: (alpha: number) => PDFName) {
  for (const s of strokes) {
    const alpha = strokeAlpha(s.tool);
    const v = Math.round(greyLevel(s.grey) * 1000) / 1000; // never an exponent, which PDF numbers lack
    out.text(alpha < 1 ? `q ${toneState(alpha).toString()} gs ${v} ${v} ${v} rg\n` : `q ${v} ${v} ${v} rg\n`);
    writeOutline(out, outlineOf(s));
    out.text('f Q\n');
  }
}

/** A length or position in points, to 0.001 pt, never with an exponent (which PDF numbers lack). */
export const pt = (v: number) => String(Math.round(v * 1000) / 1000);

/** The `cm` that maps µm of the book page, from the trim's top left, to points with the trim's corner at (x, y) pt, at a scale. */
export function strokeSpaceAt(x: number, y: number, scale = 1): string {
  const k = (72 / 25.4 / UM_PER_MM) * scale; // 0.00283… at 100 %: written in full, as a scale
  return `${k} 0 0 ${-k} ${pt(x)} ${pt(y)} cm\n`;
}

/** A rectangle's path as pdf-lib's drawRectangle makes it: from the lower-left corner, up first. */
export const rectPath = (x: number, y: number, w: number, h: number) =>
  `${pt(x)} ${pt(y)} m ${pt(x)} ${pt(y + h)} l ${pt(x + w)} ${pt(y + h)} l ${pt(x + w)} ${pt(y)} l h`;

export const FONT_KEY = PDFName.of('QF0');
/** An RGB colour, each 0…1. */
export type Rgb = [number, number, number];
/** A colour as PDF operands. */
export const rgbOperands = ([r, g, b]: Rgb) => `${pt(r)} ${pt(g)} ${pt(b)}`;

/** One line of text (or the font's encoding of it) at (x, y) pt, as content-stream text. */
export function textOps(font: PDFFont, text: string | PDFHexString, size: number, x: number, y: number, color: Rgb): string {
  const glyphs = typeof text === 'string' ? font.encodeText(text) : text;
  return `q BT ${rgbOperands(color)} rg ${FONT_KEY.toString()} ${size} Tf 1 0 0 1 ${pt(x)} ${pt(y)} Tm ${glyphs.toString()} Tj ET Q\n`;
}
