// Coverage of polygons on a grid (pure): a cell counts as covered when its
// centre is inside any polygon, by the non-zero winding rule (as canvas fills).
import type { Rect } from '@/lib/print/geometry';

export class CoverageGrid {
  readonly cells: Uint8Array;
  readonly cellW: number;
  readonly cellH: number;

  constructor(
    readonly box: Rect,
    readonly cols = 512,
    readonly rows = 512,
  ) {
    this.cells = new Uint8Array(cols * rows);
    this.cellW = box.w / cols;
    this.cellH = box.h / rows;
  }

  /** Marks the cells whose centres lie inside the polygon (mm). Returns how many were newly covered. */
  fillPolygon(poly: [number, number][]): number {
    if (poly.length < 3) return 0;
    let minY = Infinity;
    let maxY = -Infinity;
    for (const [, y] of poly) {
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
    }
    const r0 = Math.max(0, Math.ceil((minY - this.box.y) / this.cellH - 0.5));
    const r1 = Math.min(this.rows - 1, Math.floor((maxY - this.box.y) / this.cellH - 0.5));
    let added = 0;
    const xs: { x: number; w: number }[] = [];
    for (let row = r0; row <= r1; row++) {
      const y = this.box.y + (row + 0.5) * this.cellH;
      xs.length = 0;
      for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
        const [xi, yi] = poly[i]!;
        const [xj, yj] = poly[j]!;
        if (yi <= y === yj <= y) continue; // edge does not cross this scanline
        const x = xj + ((y - yj) * (xi - xj)) / (yi - yj);
        xs.push({ x, w: yi > yj ? 1 : -1 });
      }
      xs.sort((a, b) => a.x - b.x);
      let winding = 0;
      for (let k = 0; k < xs.length - 1; k++) {
        winding += xs[k]!.w;
        if (winding === 0) continue;
        const c0 = Math.max(0, Math.ceil((xs[k]!.x - this.box.x) / this.cellW - 0.5));
        const c1 = Math.min(this.cols - 1, Math.floor((xs[k + 1]!.x - this.box.x) / this.cellW - 0.5));
        const base = row * this.cols;
        for (let c = c0; c <= c1; c++) {
          if (this.cells[base + c] === 0) {
            this.cells[base + c] = 1;
            added++;
          }
        }
      }
    }
    return added;
  }

  coveredCount(): number {
    let n = 0;
    for (let i = 0; i < this.cells.length; i++) n += this.cells[i]!;
    return n;
  }

  /** Covered share of the grid, 0..1. */
  coverage(): number {
    return this.coveredCount() / this.cells.length;
  }

  /** Covered area in mm². */
  coveredArea(): number {
    return this.coveredCount() * this.cellW * this.cellH;
  }
}
