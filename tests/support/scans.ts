// Scans of inked pages made with sharp for the tests, at a known size and resolution:
// line art at 600 ppi (1-bit), tone at 300 ppi (8-bit grey), a soft 150 ppi scan, colour
// with a red mark, art that stops at the trim, ink in the band between trim and safe area.
// Sizes in mm, as printed; 1 in = 25.4 mm. Everything drawn is invented test art.
import { crc32 } from 'node:zlib';
import sharp from 'sharp';

export type ScanSpec = {
  /** The printed size the scan covers, mm. */
  w: number;
  h: number;
  ppi: number;
  /** Dark marks: rectangles in mm from the scan's top left. */
  marks?: { x: number; y: number; w: number; h: number; colour?: string }[];
  /** A mid-grey wash under everything (tone), 0–255; white paper when absent. */
  tone?: number;
  /** The resolution the file records, when it is not the one scanned at (a scanner set wrong). */
  recordedPpi?: number;
};

export const pxOf = (mm: number, ppi: number) => Math.round((mm / 25.4) * ppi);

/** The scan as an SVG at its pixel size (the marks are whole pixels, so a threshold keeps them exactly). */
function svgOf(s: ScanSpec): { svg: Buffer; width: number; height: number } {
  const width = pxOf(s.w, s.ppi);
  const height = pxOf(s.h, s.ppi);
  const k = (mm: number) => pxOf(mm, s.ppi);
  const bg = s.tone === undefined ? '#ffffff' : `rgb(${s.tone},${s.tone},${s.tone})`;
  const marks = (s.marks ?? []).map(
    (m) => `<rect x="${k(m.x)}" y="${k(m.y)}" width="${k(m.w)}" height="${k(m.h)}" fill="${m.colour ?? '#000000'}"/>`,
  );
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" shape-rendering="crispEdges"><rect width="100%" height="100%" fill="${bg}"/>${marks.join('')}</svg>`;
  return { svg: Buffer.from(svg), width, height };
}

const pxPerMm = (ppi: number) => ppi / 25.4;

/**
 * Records a resolution in a PNG: a pHYs chunk (pixels per metre, unit 1) right after IHDR
 * (PNG specification, 2nd ed., §11.3.5.3). sharp's own way (withMetadata) would turn grey into sRGB.
 */
export function withPngPpi(png: Buffer, ppi: number): Buffer {
  const perMetre = Math.round(ppi / 0.0254);
  const data = Buffer.alloc(9);
  data.writeUInt32BE(perMetre, 0);
  data.writeUInt32BE(perMetre, 4);
  data[8] = 1;
  const type = Buffer.from('pHYs', 'latin1');
  const chunk = Buffer.alloc(12 + 9);
  chunk.writeUInt32BE(9, 0);
  type.copy(chunk, 4);
  data.copy(chunk, 8);
  chunk.writeUInt32BE(crc32(Buffer.concat([type, data])), 17);
  const ihdrEnd = 8 + 8 + 13 + 4; // signature, IHDR length and type, its 13 bytes, CRC
  return Buffer.concat([png.subarray(0, ihdrEnd), chunk, png.subarray(ihdrEnd)]);
}

/**
 * Records a resolution in a JPEG: a JFIF APP0 segment right after SOI (JFIF 1.02: version 1.2,
 * units 1 = dots per inch, X and Y density, no thumbnail). sharp writes none of its own.
 */
export function withJfifPpi(jpeg: Buffer, ppi: number): Buffer {
  const app0 = Buffer.alloc(18);
  app0.writeUInt16BE(0xffe0, 0);
  app0.writeUInt16BE(16, 2);
  app0.write('JFIF\0', 4, 'latin1');
  app0[9] = 1;
  app0[10] = 2;
  app0[11] = 1;
  app0.writeUInt16BE(ppi, 12);
  app0.writeUInt16BE(ppi, 14);
  return Buffer.concat([jpeg.subarray(0, 2), app0, jpeg.subarray(2)]);
}

/** Line art: 1-bit TIFF (LZW, Deflate or CCITT group 4), the resolution recorded. */
export async function lineArtTiff(s: ScanSpec, compression: 'lzw' | 'deflate' | 'ccittfax4' = 'lzw'): Promise<Buffer> {
  const { svg } = svgOf(s);
  return sharp(svg, { density: 72 })
    .removeAlpha()
    .toColourspace('b-w')
    .threshold(128)
    .tiff({ compression, predictor: 'none', bitdepth: 1, xres: pxPerMm(s.recordedPpi ?? s.ppi), yres: pxPerMm(s.recordedPpi ?? s.ppi) })
    .toBuffer();
}

/** Tone: 8-bit grey TIFF (Deflate or LZW). */
export async function greyTiff(s: ScanSpec, compression: 'lzw' | 'deflate' = 'deflate'): Promise<Buffer> {
  const { svg } = svgOf(s);
  return sharp(svg, { density: 72 })
    .removeAlpha()
    .toColourspace('b-w')
    .tiff({ compression, xres: pxPerMm(s.ppi), yres: pxPerMm(s.ppi) })
    .toBuffer();
}

/** 8-bit grey PNG with its resolution. */
export async function greyPng(s: ScanSpec): Promise<Buffer> {
  const { svg } = svgOf(s);
  return withPngPpi(await sharp(svg, { density: 72 }).removeAlpha().toColourspace('b-w').png().toBuffer(), s.ppi);
}

/** Colour PNG (sRGB), e.g. with a red mark. */
export async function rgbPng(s: ScanSpec): Promise<Buffer> {
  const { svg } = svgOf(s);
  return withPngPpi(await sharp(svg, { density: 72 }).removeAlpha().png().toBuffer(), s.ppi);
}

/**
 * A JPEG as a camera or a scanner's software writes it: Exif with the maker and a GPS position.
 * With an orientation other than 1 it is colour (sharp sets the orientation through withMetadata,
 * which writes sRGB); otherwise grey when asked. The resolution goes in the JFIF header.
 */
export async function jpegWithExif(s: ScanSpec, opts: { grey?: boolean; orientation?: number } = {}): Promise<Buffer> {
  const { svg } = svgOf(s);
  let pipe = sharp(svg, { density: 72 }).removeAlpha();
  if (opts.grey) pipe = pipe.toColourspace('b-w');
  if (opts.orientation && opts.orientation !== 1) pipe = pipe.withMetadata({ orientation: opts.orientation });
  const jpeg = await pipe
    .withExif({
      IFD0: { Artist: 'Kettle Crab studio', XResolution: `${s.ppi}/1`, YResolution: `${s.ppi}/1`, ResolutionUnit: '2' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1' },
    })
    .jpeg({ quality: 90 })
    .toBuffer();
  return withJfifPpi(jpeg, s.ppi);
}

/** The decoded pixels, one channel (grey) or three, for comparing what was kept with what was sent. */
export async function pixels(image: Buffer, channels: 1 | 3 = 1): Promise<{ data: Buffer; width: number; height: number }> {
  const pipe = sharp(image).rotate();
  const { data, info } = await (channels === 1 ? pipe.toColourspace('b-w') : pipe.removeAlpha().toColourspace('srgb'))
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height };
}

export function form(bytes: Buffer, name: string, type: string): FormData {
  const f = new FormData();
  f.append('file', new File([new Uint8Array(bytes)], name, { type }));
  return f;
}
