// Reading rendered pages (pdftoppm → PNG) back as pixels, and laying outlines over them:
// which pixel centres an outline covers, found with the same non-zero scanline fill the
// findings use (lib/review/raster), on a grid whose cells are the image's pixels.
import { execFileSync } from 'node:child_process';
import sharp from 'sharp';
import { CoverageGrid } from '@/lib/review/raster';

export type Image = { width: number; height: number; data: Buffer };

/** Renders one page of a PDF at `dpi` (or a crop of it, in pixels at that dpi) and reads it as RGB. */
export async function renderPage(
  file: string,
  page: number,
  dpi: number,
  base: string,
  crop?: { x: number; y: number; w: number; h: number },
): Promise<Image> {
  const area = crop ? ['-x', String(crop.x), '-y', String(crop.y), '-W', String(crop.w), '-H', String(crop.h)] : [];
  execFileSync('pdftoppm', ['-f', String(page), '-l', String(page), '-r', String(dpi), ...area, '-png', '-singlefile', file, base]);
  const { data, info } = await sharp(`${base}.png`).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  return { width: info.width, height: info.height, data };
}

export const rgbAt = (img: Image, x: number, y: number): [number, number, number] => {
  const i = (y * img.width + x) * 3;
  return [img.data[i]!, img.data[i + 1]!, img.data[i + 2]!];
};

export const lum = ([r, g, b]: [number, number, number]) => 0.299 * r + 0.587 * g + 0.114 * b;

/**
 * Where the book page sits in the image: (x0, y0) is the trim's top-left corner in image
 * coordinates (pixel p spans p … p + 1) and k the pixels per book millimetre.
 */
export type Placement = { x0: number; y0: number; k: number };

/** The pixels an outline (its polygons, book mm) covers, in a box of pixels around it. */
export function coveredPixels(polys: [number, number][][], at: Placement, img: Image, padPx: number) {
  const xs = polys.flat().map((p) => p[0]);
  const ys = polys.flat().map((p) => p[1]);
  const px0 = Math.max(0, Math.floor(at.x0 + Math.min(...xs) * at.k) - padPx);
  const py0 = Math.max(0, Math.floor(at.y0 + Math.min(...ys) * at.k) - padPx);
  const px1 = Math.min(img.width - 1, Math.ceil(at.x0 + Math.max(...xs) * at.k) + padPx);
  const py1 = Math.min(img.height - 1, Math.ceil(at.y0 + Math.max(...ys) * at.k) + padPx);
  const w = px1 - px0 + 1;
  const h = py1 - py0 + 1;
  const grid = new CoverageGrid({ x: (px0 - at.x0) / at.k, y: (py0 - at.y0) / at.k, w: w / at.k, h: h / at.k }, w, h);
  for (const p of polys) grid.fillPolygon(p);
  const inside = (x: number, y: number) => x >= px0 && x <= px1 && y >= py0 && y <= py1 && grid.cells[(y - py0) * w + x - px0] === 1;
  return { px0, py0, px1, py1, inside };
}
