// What poppler (Debian's poppler-utils) reads in a PDF, for the tests: the page boxes
// (`pdfinfo -box`), each image's pixels (`pdfimages -list`) and the fonts (`pdffonts`).
import { execFileSync } from 'node:child_process';

type Box = number[];

/** The page count and every page's MediaBox, BleedBox and TrimBox in pt, [x0, y0, x1, y1]. */
export function pdfBoxesOf(file: string): { pages: number; media: Box[]; bleed: Box[]; trim: Box[] } {
  const out = execFileSync('pdfinfo', ['-box', '-f', '1', '-l', '999', file], { encoding: 'utf8' });
  const read = (kind: string) =>
    [...out.matchAll(new RegExp(`^Page\\s+(\\d+)\\s+${kind}:\\s+([\\d.]+)\\s+([\\d.]+)\\s+([\\d.]+)\\s+([\\d.]+)`, 'gm'))].map((m) =>
      m.slice(2).map(Number),
    );
  return { pages: Number(out.match(/^Pages:\s+(\d+)/m)![1]), media: read('MediaBox'), bleed: read('BleedBox'), trim: read('TrimBox') };
}

/** `pdfimages -list`: page, width, height, color, bits per component, encoding, x-ppi, y-ppi of each image. */
export function pdfImagesOf(file: string) {
  return execFileSync('pdfimages', ['-list', file], { encoding: 'utf8' })
    .split('\n')
    .slice(2)
    .filter((l) => l.trim())
    .map((l) => {
      const c = l.trim().split(/\s+/);
      return {
        page: Number(c[0]),
        width: Number(c[3]),
        height: Number(c[4]),
        color: c[5],
        bpc: Number(c[7]),
        enc: c[8],
        xppi: Number(c[12]),
        yppi: Number(c[13]),
      };
    });
}

/** `pdffonts`: one line per font (after the two header lines). */
export const pdfFontsOf = (file: string) =>
  execFileSync('pdffonts', [file], { encoding: 'utf8' })
    .split('\n')
    .slice(2)
    .filter((l) => l.trim());
