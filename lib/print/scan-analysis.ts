// What the preflight needs to know about a scan's pixels, measured once per final page
// and kept: a coarse grid over the scan (at most 256 cells along its longer side) holding,
// per cell, the share of inked pixels and the share of colour pixels (each 0–255). The
// rows of pixels arrive in order, a few at a time, so a scan of any size is measured in
// bounded memory. Pure: the server feeds it rows from sharp.

export const ANALYSIS_VERSION = 1;
export const GRID_MAX_CELLS = 256;

/** A pixel is ink when its grey level is below this (0 black … 255 white): about 22 % coverage or more. Our rule of thumb. */
export const INK_BELOW = 200;
/**
 * A pixel is colour when its channels spread by more than this (of 255): scanner noise and JPEG
 * fringes around black lines stay under it, a coloured pencil or a red mark does not. Our rule of thumb.
 */
export const COLOUR_SPREAD = 32;

export type ScanAnalysis = {
  version: number;
  width: number;
  height: number;
  /** Scan pixels per cell side. */
  cell: number;
  cols: number;
  rows: number;
  /** Per cell, row by row: the share of ink pixels and of colour pixels, × 255. */
  ink: Uint8Array;
  colour: Uint8Array;
  colourPixels: number;
};

export function gridFor(width: number, height: number) {
  const cell = Math.max(1, Math.ceil(Math.max(width, height) / GRID_MAX_CELLS));
  return { cell, cols: Math.ceil(width / cell), rows: Math.ceil(height / cell) };
}

/** Takes raw rows of 1 (grey) or 3 (RGB) 8-bit channels, in order, in chunks of any length. */
export class ScanAnalyser {
  private readonly grid: ReturnType<typeof gridFor>;
  private readonly inkCount: Uint32Array;
  private readonly colourCount: Uint32Array;
  private colourPixels = 0;
  private x = 0;
  private y = 0;
  /** A pixel split across two chunks waits here. */
  private carry: number[] = [];

  constructor(
    private readonly width: number,
    private readonly height: number,
    private readonly channels: 1 | 3,
  ) {
    this.grid = gridFor(width, height);
    this.inkCount = new Uint32Array(this.grid.cols * this.grid.rows);
    this.colourCount = new Uint32Array(this.grid.cols * this.grid.rows);
  }

  private pixel(a: number, b: number, c: number) {
    const { cell, cols } = this.grid;
    const i = Math.floor(this.y / cell) * cols + Math.floor(this.x / cell);
    if (this.channels === 1) {
      if (a < INK_BELOW) this.inkCount[i]!++;
    } else {
      // Rec. 601 luma for ink, as the print file converts colour to grey (ITU-R BT.601).
      if (0.299 * a + 0.587 * b + 0.114 * c < INK_BELOW) this.inkCount[i]!++;
      if (Math.max(a, b, c) - Math.min(a, b, c) > COLOUR_SPREAD) {
        this.colourCount[i]!++;
        this.colourPixels++;
      }
    }
    if (++this.x === this.width) {
      this.x = 0;
      this.y++;
    }
  }

  push(chunk: Uint8Array) {
    let at = 0;
    const n = this.channels;
    if (this.carry.length) {
      while (this.carry.length < n && at < chunk.length) this.carry.push(chunk[at++]!);
      if (this.carry.length < n) return;
      this.pixel(this.carry[0]!, this.carry[1] ?? 0, this.carry[2] ?? 0);
      this.carry = [];
    }
    if (n === 1) for (; at < chunk.length; at++) this.pixel(chunk[at]!, 0, 0);
    else {
      for (; at + 2 < chunk.length; at += 3) this.pixel(chunk[at]!, chunk[at + 1]!, chunk[at + 2]!);
      while (at < chunk.length) this.carry.push(chunk[at++]!);
    }
  }

  result(): ScanAnalysis {
    if (this.y !== this.height) throw new Error(`scan ended after ${this.y} of ${this.height} rows`);
    const { cell, cols, rows } = this.grid;
    const ink = new Uint8Array(cols * rows);
    const colour = new Uint8Array(cols * rows);
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        const i = r * cols + c;
        const pixels = Math.min(cell, this.width - c * cell) * Math.min(cell, this.height - r * cell) || 1;
        ink[i] = Math.round((this.inkCount[i]! / pixels) * 255);
        colour[i] = Math.round((this.colourCount[i]! / pixels) * 255);
      }
    }
    return { version: ANALYSIS_VERSION, width: this.width, height: this.height, cell, cols, rows, ink, colour, colourPixels: this.colourPixels };
  }
}

/** The share (0–1) of ink, or of colour, in the cell under a scan pixel; 0 off the scan. */
export function shareAt(a: ScanAnalysis, which: 'ink' | 'colour', px: number, py: number): number {
  if (px < 0 || py < 0 || px >= a.width || py >= a.height) return 0;
  const i = Math.floor(py / a.cell) * a.cols + Math.floor(px / a.cell);
  return (which === 'ink' ? a.ink : a.colour)[i]! / 255;
}
