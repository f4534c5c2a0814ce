// Blue-line sheets for the drawing desk: per gag, its page at a scale with bleed,
// trim, safe area and panels, the approved pass's strokes as faint guide lines
// (light blue or grey), its balloon rooms dashed, and the four beat notes under
// the page. Each page is drawn once as a form (the "canvas", lib/print/sheets.ts)
// and placed on one sheet, or on several tiled sheets that share overlap marks.
import { PDFName, type PDFFont, type PDFRef } from 'pdf-lib';
import { BEAT_KINDS, BEAT_LABELS, type BeatKind } from '@/lib/gags/status';
import { type PageSpec, type Rect, mmToPt, panelRects, safeBox } from '@/lib/print/geometry';
import { type GuideColour, PAPERS, type Paper, SHEET_MARGIN, type SheetCanvas, TILE_EDGE, guideTint, sheetCanvas, tiling } from '@/lib/print/sheets';
import { outlineOf } from '@/lib/strokes/outline';
import { type Room, type Stroke, strokeAlpha } from '@/lib/strokes/types';
import {
  ContentWriter,
  FONT_KEY,
  PRINTER_NOTE,
  type Rgb,
  newDoc,
  pt,
  rectPath,
  rgbOperands,
  strokeSpaceAt,
  textOps,
  writeOutline,
} from './pdf-content';

/** One gag's sheet: its notes, and the approved pass (null: not ready to ink, so the panels stay blank). */
export type SheetGag = {
  page: number;
  title: string;
  notes: { kind: BeatKind; note: string }[];
  approved: { passNumber: number; strokes: Stroke[]; rooms: Room[] } | null;
};

export type BlueLineOptions = {
  /** 1 = printed size. */
  scale: number;
  paper: Paper;
  /** Cut a page too big for the paper across several sheets (else the caller has checked it fits). */
  tiled: boolean;
  colour: GuideColour;
  /** 0.2…1: how much of the guide colour the darkest marks get. */
  strength: number;
};

const INK: Rgb = [0.16, 0.16, 0.18];
const FAINT: Rgb = [0.45, 0.45, 0.47];
const NOTE_SIZE = 7; // pt
const NOTE_LINE = 3; // mm
const NOTE_LINES = 3;

/** Lines of at most `width` pt, the last cut with an ellipsis when there would be more than `max`. */
function wrap(font: PDFFont, text: string, size: number, width: number, max: number): string[] {
  const words = text.split(/\s+/).filter(Boolean);
  const lines: string[] = [];
  let line = '';
  for (const word of words) {
    const next = line ? `${line} ${word}` : word;
    if (font.widthOfTextAtSize(next, size) <= width || !line) line = next;
    else {
      lines.push(line);
      line = word;
    }
  }
  if (line) lines.push(line);
  if (lines.length <= max) return lines;
  const kept = lines.slice(0, max);
  let last = `${kept[max - 1]!} …`;
  while (font.widthOfTextAtSize(last, size) > width && last.length > 2) last = `${last.slice(0, -3)} …`;
  kept[max - 1] = last;
  return kept;
}

/** A closed ellipse path (four cubic Béziers, the common 0.5523 handle length). */
function ellipsePath(cx: number, cy: number, rx: number, ry: number): string {
  const k = 0.5523;
  const [ox, oy] = [rx * k, ry * k];
  const p = (...v: number[]) => v.map(pt).join(' ');
  return [
    `${p(cx - rx, cy)} m`,
    `${p(cx - rx, cy + oy, cx - ox, cy + ry, cx, cy + ry)} c`,
    `${p(cx + ox, cy + ry, cx + rx, cy + oy, cx + rx, cy)} c`,
    `${p(cx + rx, cy - oy, cx + ox, cy - ry, cx, cy - ry)} c`,
    `${p(cx - ox, cy - ry, cx - rx, cy - oy, cx - rx, cy)} c h`,
  ].join(' ');
}

/** Writes one gag's canvas: pt, origin at the canvas's bottom left. */
function drawCanvas(out: ContentWriter, font: PDFFont, spec: PageSpec, c: SheetCanvas, gag: SheetGag | null, o: BlueLineOptions) {
  const H = mmToPt(c.h);
  const S = c.scale;
  // Canvas mm → pt, and the book page's mm (from the trim's top left) → pt.
  const cx = (mm: number) => mmToPt(mm);
  const cy = (mm: number) => H - mmToPt(mm);
  const bx = (mm: number) => cx(c.trimX + mm * S);
  const by = (mm: number) => cy(c.trimY + mm * S);
  const box = (r: Rect) => rectPath(bx(r.x), by(r.y + r.h), mmToPt(r.w * S), mmToPt(r.h * S));
  const text = (s: string, size: number, xMm: number, yMm: number, color: Rgb = INK) => out.text(textOps(font, s, size, cx(xMm), cy(yMm), color));

  out.text(
    `q 0.35 w [3 2] 0 d 0.72 0.2 0.12 RG ${box({ x: -spec.bleed, y: -spec.bleed, w: spec.trimW + 2 * spec.bleed, h: spec.trimH + 2 * spec.bleed })} S Q\n`,
  );
  out.text(`q 0.35 w ${rgbOperands(INK)} RG ${box({ x: 0, y: 0, w: spec.trimW, h: spec.trimH })} S Q\n`);
  out.text(`q 0.35 w [2 2] 0 d 0.11 0.31 0.43 RG ${box(safeBox(spec))} S Q\n`);
  const pass = gag?.approved;
  panelRects(spec).forEach((r, i) => {
    if (pass) {
      out.text(`q ${box(r)} W n\n`);
      for (const room of pass.rooms.filter((x) => x.panel === i)) {
        const shape =
          room.shape === 'ellipse'
            ? ellipsePath(bx(room.x + room.w / 2), by(room.y + room.h / 2), mmToPt((room.w / 2) * S), mmToPt((room.h / 2) * S))
            : box(room);
        out.text(`q 0.8 w [3 2] 0 d ${rgbOperands(guideTint(o.colour, o.strength))} RG ${shape} S Q\n`);
      }
      // Tones under pens: the tints are solid, so a tone laid later must not hide a line.
      const own = pass.strokes.filter((s) => s.panel === i);
      const ordered = [...own.filter((s) => s.tool === 'tone'), ...own.filter((s) => s.tool !== 'tone')];
      if (ordered.length) {
        out.text(`q ${strokeSpaceAt(bx(0), by(0), S)}`);
        for (const s of ordered) {
          out.text(`${rgbOperands(guideTint(o.colour, o.strength, (s.grey / 100) * strokeAlpha(s.tool)))} rg\n`);
          writeOutline(out, outlineOf(s));
          out.text('f\n');
        }
        out.text('Q\n');
      }
      out.text('Q\n');
    }
    out.text(`q 0.6 w 0.55 0.54 0.51 RG ${box(r)} S Q\n`);
    out.text(textOps(font, `${i + 1} ${BEAT_LABELS[BEAT_KINDS[i]!]}`, 7, bx(r.x) + 3, by(r.y) - 9, [0.6, 0.6, 0.62]));
  });
  // Crop marks on the trim lines, from 1 mm outside the bleed, 5 mm long.
  const gap = mmToPt(spec.bleed * S + 1);
  const len = mmToPt(5);
  for (const [x, y, sx, sy] of [
    [bx(0), by(0), -1, 1],
    [bx(spec.trimW), by(0), 1, 1],
    [bx(0), by(spec.trimH), -1, -1],
    [bx(spec.trimW), by(spec.trimH), 1, -1],
  ] as const) {
    const h = `${pt(x + sx * gap)} ${pt(y)} m ${pt(x + sx * (gap + len))} ${pt(y)} l`;
    const v = `${pt(x)} ${pt(y + sy * gap)} m ${pt(x)} ${pt(y + sy * (gap + len))} l`;
    out.text(`q 0.3 w 0 0 0 RG ${h} ${v} S Q\n`);
  }
  // The 10 mm scale bar at the sheet's scale, starting on the trim's left edge.
  out.text(`q ${rgbOperands(INK)} rg ${rectPath(bx(0), cy(c.barY + 1.5), mmToPt(10 * S), mmToPt(1.5))} f Q\n`);
  text(`10 mm at ${Math.round(S * 100)} %`, 7, c.trimX + 10 * S + 1.5, c.barY + 1.5);
  if (gag) {
    const status = pass ? `pass ${pass.passNumber}, approved to ink` : 'not ready to ink: no approved pass, blank panels';
    text(`${gag.page}. ${gag.title}`.slice(0, 90), 9, SHEET_MARGIN, SHEET_MARGIN + 4);
    text(status, 7, SHEET_MARGIN, SHEET_MARGIN + 7.5, FAINT);
    // The four beat notes, under the page: outside the bleed, so the page itself stays clear.
    const width = mmToPt(c.w - 2 * SHEET_MARGIN);
    let y = c.notesY + NOTE_LINE;
    for (const kind of BEAT_KINDS) {
      const note = gag.notes.find((n) => n.kind === kind)?.note.trim() || '(no note yet)';
      for (const line of wrap(font, `${BEAT_KINDS.indexOf(kind) + 1} ${BEAT_LABELS[kind]}: ${note}`, NOTE_SIZE, width, NOTE_LINES)) {
        text(line, NOTE_SIZE, SHEET_MARGIN, y);
        y += NOTE_LINE;
      }
      y += 0.5;
    }
  }
  text(PRINTER_NOTE, 6, SHEET_MARGIN, c.h - SHEET_MARGIN / 2, FAINT);
}

/** Overlap marks on the canvas where tiles meet: the line to cut along and crosses to lay on each other. */
function drawSeams(out: ContentWriter, c: SheetCanvas, t: ReturnType<typeof tiling>) {
  const H = mmToPt(c.h);
  const cross = (x: number, y: number) => {
    const [X, Y, r] = [mmToPt(x), H - mmToPt(y), mmToPt(2.5)];
    out.text(
      `q 0.4 w 0 0 0 RG ${pt(X - r)} ${pt(Y)} m ${pt(X + r)} ${pt(Y)} l ${pt(X)} ${pt(Y - r)} m ${pt(X)} ${pt(Y + r)} l S ${ellipsePath(X, Y, r * 0.6, r * 0.6)} S Q\n`,
    );
  };
  for (const x of t.seamsX) {
    out.text(`q 0.3 w [1 2] 0 d 0.3 0.3 0.3 RG ${pt(mmToPt(x))} 0 m ${pt(mmToPt(x))} ${pt(H)} l S Q\n`);
    for (const tile of t.tiles.filter((k) => k.col === 0)) for (const f of [0.25, 0.75]) cross(x, tile.y + f * t.window.h);
  }
  for (const y of t.seamsY) {
    out.text(`q 0.3 w [1 2] 0 d 0.3 0.3 0.3 RG 0 ${pt(H - mmToPt(y))} m ${pt(mmToPt(c.w))} ${pt(H - mmToPt(y))} l S Q\n`);
    for (const tile of t.tiles.filter((k) => k.row === 0)) for (const f of [0.25, 0.75]) cross(tile.x + f * t.window.w, y);
  }
}

/** The sheets: one a gag (or one blank template when no gag is chosen), each on one paper or tiled across several. */
export async function blueLinePdf(spec: PageSpec, title: string, gags: SheetGag[], o: BlueLineOptions): Promise<Uint8Array> {
  const pct = Math.round(o.scale * 100);
  const { doc, font } = await newDoc(`${title} — blue-line sheets ${pct} % on ${o.paper}`);
  const c = sheetCanvas(spec, o.scale);
  const t = o.tiled ? tiling(c, o.paper) : null;
  const laid = t ? t.sheet : PAPERS[o.paper];
  const paper = { w: mmToPt(laid.w), h: mmToPt(laid.h) };
  const out = new ContentWriter();
  const list: (SheetGag | null)[] = gags.length ? gags : [null];
  for (const [n, gag] of list.entries()) {
    drawCanvas(out, font, spec, c, gag, o);
    if (t && t.tiles.length > 1) drawSeams(out, c, t);
    const form: PDFRef = doc.context.register(
      doc.context.stream(out.deflated(), {
        Type: 'XObject',
        Subtype: 'Form',
        BBox: [0, 0, mmToPt(c.w), mmToPt(c.h)],
        Resources: { Font: { QF0: font.ref } }, // FONT_KEY, as textOps names it
        Filter: 'FlateDecode',
      }),
    );
    out.reset();
    const name = `QC${n}`;
    const tiles = t ? t.tiles : [{ col: 0, row: 0, x: (c.w - laid.w) / 2, y: (c.h - laid.h) / 2 }];
    const edge = t ? TILE_EDGE : 0;
    for (const [k, tile] of tiles.entries()) {
      const page = doc.addPage([paper.w, paper.h]);
      page.node.setXObject(PDFName.of(name), form);
      page.node.setFontDictionary(FONT_KEY, font.ref);
      // The canvas point (tile.x, tile.y) lands on the window's top-left corner, `edge` in from the paper's.
      const dx = mmToPt(edge - tile.x);
      const dy = paper.h - mmToPt(edge) - mmToPt(c.h) + mmToPt(tile.y);
      const win = rectPath(mmToPt(edge), mmToPt(edge), paper.w - 2 * mmToPt(edge), paper.h - 2 * mmToPt(edge));
      out.text(`q ${win} W n 1 0 0 1 ${pt(dx)} ${pt(dy)} cm /${name} Do Q\n`);
      if (t && tiles.length > 1) {
        const label = `${gag ? `${gag.page}. ${gag.title}`.slice(0, 60) : 'Blank template'} · sheet ${k + 1} of ${tiles.length} (row ${tile.row + 1}, column ${tile.col + 1}) · cut one sheet on the dotted line and lay its crosses on its neighbour's`;
        out.text(textOps(font, label, 6, mmToPt(edge), paper.h - mmToPt(edge) + 8, FAINT));
        out.text(`q 0.3 w 0.6 0.6 0.6 RG ${win} S Q\n`);
      }
      out.finish(doc, page);
    }
  }
  return doc.save();
}
