// A final page's pixels as a PDF image stream, at the scan's own pixel size (never
// resampled): 1-bit line art stays 1 bit per sample, grey stays 8-bit grey, a grey
// JPEG goes in as its own bytes (DCTDecode, not re-encoded), and colour becomes grey
// (the book is greyscale) with a note saying so. One page's pixels are in memory at
// a time; the caller writes the stream and lets it go.
import { readFile } from 'node:fs/promises';
import { deflateSync } from 'node:zlib';
import { PDFName, PDFNumber, type PDFObject } from 'pdf-lib';
import sharp from 'sharp';
import { FINAL_MAX_PIXELS } from '@/lib/uploads/final-page';

export type KeptScan = {
  /** The kept file on disk (lib/uploads/final-page.ts: an upright JPEG as it came, or a lossless TIFF). */
  path: string;
  mime: 'image/tiff' | 'image/jpeg';
  width: number;
  height: number;
  bitsPerPixel: number;
};

export type ImageStream = { bytes: Uint8Array; dict: Record<string, PDFObject>; bitsPerComponent: 1 | 8; convertedToGrey: boolean };

/**
 * Packs 8-bit grey samples (0 black … 255 white) into 1-bit rows, each row padded
 * to a whole byte, most significant bit first; 1 is white (DeviceGray's default
 * decode, ISO 32000-1 §8.9.5.2). A 1-bit scan decodes to 0 and 255 only.
 */
export function packBits(grey: Uint8Array, width: number, height: number): Uint8Array {
  const rowBytes = (width + 7) >> 3;
  const out = new Uint8Array(rowBytes * height);
  for (let y = 0; y < height; y++) {
    const src = y * width;
    const dst = y * rowBytes;
    for (let x = 0; x < width; x += 8) {
      let b = 0;
      const end = Math.min(8, width - x);
      for (let k = 0; k < end; k++) if (grey[src + x + k]! >= 128) b |= 0x80 >> k;
      out[dst + (x >> 3)] = b;
    }
  }
  return out;
}

const name = (s: string) => PDFName.of(s);

/** The image stream of one kept scan. */
export async function imageStream(scan: KeptScan): Promise<ImageStream> {
  const meta = await sharp(scan.path, { limitInputPixels: FINAL_MAX_PIXELS }).metadata();
  const channels = (meta.channels ?? 1) - (meta.hasAlpha ? 1 : 0);
  const colour = channels >= 3;
  const base = { Type: name('XObject'), Subtype: name('Image'), ColorSpace: name('DeviceGray') };
  if (scan.mime === 'image/jpeg' && !colour && meta.width === scan.width && meta.height === scan.height) {
    // A grey JPEG as it came: the printer's RIP decodes the same DCT data the scanner wrote.
    const bytes = await readFile(scan.path);
    return {
      bytes,
      dict: {
        ...base,
        Width: PDFNumber.of(scan.width),
        Height: PDFNumber.of(scan.height),
        BitsPerComponent: PDFNumber.of(8),
        Filter: name('DCTDecode'),
      },
      bitsPerComponent: 8,
      convertedToGrey: false,
    };
  }
  const oneBit = scan.bitsPerPixel === 1;
  const { data, info } = await sharp(scan.path, { limitInputPixels: FINAL_MAX_PIXELS })
    .flatten({ background: '#ffffff' })
    .toColourspace('b-w')
    .raw({ depth: 'uchar' })
    .toBuffer({ resolveWithObject: true });
  if (info.width !== scan.width || info.height !== scan.height || info.channels !== 1) {
    throw new Error(`The kept scan decodes as ${info.width} × ${info.height} × ${info.channels}, not ${scan.width} × ${scan.height} grey.`);
  }
  const samples = oneBit ? packBits(data, info.width, info.height) : data;
  const bytes = deflateSync(samples, { level: 6 });
  return {
    bytes,
    dict: {
      ...base,
      Width: PDFNumber.of(info.width),
      Height: PDFNumber.of(info.height),
      BitsPerComponent: PDFNumber.of(oneBit ? 1 : 8),
      Filter: name('FlateDecode'),
    },
    bitsPerComponent: oneBit ? 1 : 8,
    convertedToGrey: colour,
  };
}
