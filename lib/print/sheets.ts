// Blue-line sheets on paper (pure): how one page of the book is laid out on a
// sheet at a scale, which scale × paper pairs fit one sheet, and how a page too
// big for one is tiled across several with an overlap. Lengths are millimetres
// of the paper (not of the book page), from the sheet's top left, y down.
import type { GagStatus } from '@/lib/gags/status';
import type { PageSpec } from './geometry';

/** ISO 216 A sizes, portrait. */
export const PAPERS = { A4: { w: 210, h: 297 }, A3: { w: 297, h: 420 } } as const;
export type Paper = keyof typeof PAPERS;
export const PAPER_NAMES = Object.keys(PAPERS) as Paper[];

/** The scales offered, in percent of the printed size. */
export const SHEET_SCALES = [100, 150, 200] as const;
export type SheetScale = (typeof SHEET_SCALES)[number];

/** Paper kept round the drawing: the crop marks reach 6 mm past the bleed. */
export const SHEET_MARGIN = 8;
/** The gag's title, above the page and clear of the crop marks. */
export const TITLE_BAND = 15;
/** Under the page: clear of the crop marks, the 10 mm scale bar. */
export const BAR_GAP = 7.5;
export const BAR_BAND = 11;
/** The four beat notes, under the scale bar: up to three lines each. */
export const NOTES_BAND = 38;

/** A tiled sheet keeps this much paper round its window (labels, the printer's edge)… */
export const TILE_EDGE = 10;
/** …and shares this much of the drawing with its neighbour, where the overlap marks sit. */
export const TILE_OVERLAP = 15;
/** Tilings needing more sheets than this for one page are not offered. */
export const MAX_TILES = 16;

type Box = { x: number; y: number; w: number; h: number };

/** One page laid out for the drawing desk, before it is put on paper: the "canvas". */
export type SheetCanvas = {
  w: number;
  h: number;
  scale: number;
  /** The book's bleed box on the canvas. */
  bleed: Box;
  /** The trim's top-left corner on the canvas: book mm (x, y) sit at trimX + x·scale, trimY + y·scale. */
  trimX: number;
  trimY: number;
  /** Top of the 10 mm scale bar; the notes start at notesY. */
  barY: number;
  notesY: number;
};

export function sheetCanvas(spec: PageSpec, scale: number): SheetCanvas {
  const bw = (spec.trimW + 2 * spec.bleed) * scale;
  const bh = (spec.trimH + 2 * spec.bleed) * scale;
  const bleed = { x: SHEET_MARGIN, y: SHEET_MARGIN + TITLE_BAND, w: bw, h: bh };
  return {
    w: bw + 2 * SHEET_MARGIN,
    h: SHEET_MARGIN + TITLE_BAND + bh + BAR_BAND + NOTES_BAND + SHEET_MARGIN,
    scale,
    bleed,
    trimX: bleed.x + spec.bleed * scale,
    trimY: bleed.y + spec.bleed * scale,
    barY: bleed.y + bh + BAR_GAP,
    notesY: bleed.y + bh + BAR_BAND,
  };
}

/** Does the page at this scale, with its marks, title, bar and notes, fit one sheet? */
export function fitsOneSheet(spec: PageSpec, scale: number, paper: Paper): boolean {
  const c = sheetCanvas(spec, scale);
  return c.w <= PAPERS[paper].w + 1e-9 && c.h <= PAPERS[paper].h + 1e-9;
}

/** One sheet of a tiling: which part of the canvas its window shows. */
export type Tile = { col: number; row: number; x: number; y: number };

/**
 * A canvas cut into windows of one paper size, neighbours sharing TILE_OVERLAP mm, the
 * paper turned whichever way takes fewer sheets (upright when even). Each sheet's window
 * (the paper less TILE_EDGE all round) shows the canvas from (tile.x, tile.y); the first
 * sheet starts at the canvas's top left, and a single row or column is centred. `seamsX`
 * and `seamsY` are the middles of the shared bands, in canvas mm: the overlap marks and
 * the line to cut along lie there, on both sheets alike.
 */
export type Tiling = {
  cols: number;
  rows: number;
  landscape: boolean;
  /** The paper as laid, and its window. */
  sheet: { w: number; h: number };
  window: { w: number; h: number };
  tiles: Tile[];
  seamsX: number[];
  seamsY: number[];
};

function split(length: number, window: number) {
  const step = window - TILE_OVERLAP;
  const n = length <= window + 1e-9 ? 1 : Math.ceil((length - TILE_OVERLAP) / step - 1e-9);
  const start = n === 1 ? (length - window) / 2 : 0;
  return {
    n,
    starts: Array.from({ length: n }, (_, i) => start + i * step),
    seams: Array.from({ length: n - 1 }, (_, i) => start + (i + 1) * step + TILE_OVERLAP / 2),
  };
}

function tilingOn(canvas: { w: number; h: number }, sheet: { w: number; h: number }, landscape: boolean): Tiling {
  const window = { w: sheet.w - 2 * TILE_EDGE, h: sheet.h - 2 * TILE_EDGE };
  const across = split(canvas.w, window.w);
  const down = split(canvas.h, window.h);
  const tiles: Tile[] = [];
  down.starts.forEach((y, row) => across.starts.forEach((x, col) => tiles.push({ col, row, x, y })));
  return { cols: across.n, rows: down.n, landscape, sheet, window, tiles, seamsX: across.seams, seamsY: down.seams };
}

export function tiling(canvas: { w: number; h: number }, paper: Paper): Tiling {
  const { w, h } = PAPERS[paper];
  const upright = tilingOn(canvas, { w, h }, false);
  const turned = tilingOn(canvas, { w: h, h: w }, true);
  return turned.tiles.length < upright.tiles.length ? turned : upright;
}

/** A size the export offers: one sheet a page when it fits, else tiled (and then how many sheets). */
export type SheetSize = { scale: SheetScale; paper: Paper; tiled: boolean; sheetsPerPage: number };

export function sheetSizes(spec: PageSpec): SheetSize[] {
  const out: SheetSize[] = [];
  for (const scale of SHEET_SCALES) {
    for (const paper of PAPER_NAMES) {
      if (fitsOneSheet(spec, scale / 100, paper)) {
        out.push({ scale, paper, tiled: false, sheetsPerPage: 1 });
        continue;
      }
      const t = tiling(sheetCanvas(spec, scale / 100), paper);
      if (t.tiles.length <= MAX_TILES) out.push({ scale, paper, tiled: true, sheetsPerPage: t.tiles.length });
    }
  }
  return out;
}

export function sizeLabel(s: SheetSize): string {
  return s.tiled ? `${s.scale} % on ${s.paper}, tiled on ${s.sheetsPerPage} sheets a page` : `${s.scale} % on ${s.paper}`;
}

/**
 * The guide's colours, RGB 0…1. Blue is the light "non-photo" blue the trade roughs in, which
 * scans and photocopies drop (common practice; the colour usually given for it is #A4DDED, from memory).
 */
export const GUIDE_COLOURS = { blue: [164 / 255, 221 / 255, 237 / 255], grey: [0.62, 0.62, 0.62] } as const;
export type GuideColour = keyof typeof GUIDE_COLOURS;
export const GUIDE_NAMES = Object.keys(GUIDE_COLOURS) as GuideColour[];
export const GUIDE_STRENGTH = { min: 20, max: 100, default: 100 } as const;

/**
 * The solid colour of a guide mark: the guide colour mixed with white, by the strength (0…1)
 * times the mark's own amount (0…1: a pen's grey, a tone's grey and translucency). Solid, not
 * transparent, so a sheet prints as flat tints and crossing marks never darken.
 */
export function guideTint(colour: GuideColour, strength: number, amount = 1): [number, number, number] {
  const k = Math.max(0, Math.min(1, strength * amount));
  const [r, g, b] = GUIDE_COLOURS[colour];
  return [1 - (1 - r) * k, 1 - (1 - g) * k, 1 - (1 - b) * k];
}

/** A gag page of the running order as the blue-line export offers it, with the pass its standing "ready to ink" stamp approved. */
export type SheetChoiceGag = {
  gagId: string;
  page: number;
  title: string;
  status: GagStatus | null;
  approved: { passId: string; passNumber: number; passSeq: number; stampedAt: string; by: string } | null;
};
