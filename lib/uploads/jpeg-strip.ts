// A JPEG without its private metadata, losslessly: the file's marker segments are
// copied as they are, except the ones that carry metadata, and the compressed image
// data is not touched — so the pixels decode exactly as before. Segment layout as in
// ITU-T T.81 (JPEG) Annex B: FF xx markers, a 2-byte big-endian length that counts
// itself, standalone markers (SOI, RSTn, TEM) without one; the scan data runs from
// SOS on and is copied to the end whole.
//
// Kept: APP0 "JFIF" (the pixel density), APP2 "ICC_PROFILE" (how to read the colours),
// APP14 "Adobe" (the colour transform the decoder needs), and every table and frame
// segment. Dropped: APP1 (Exif — camera, time, GPS position — and XMP), the other
// APPn (IPTC, Photoshop resources, maker data, multi-picture), and comments (COM).

const SOI = 0xd8;
const SOS = 0xda;
const COM = 0xfe;

const startsWith = (buf: Buffer, at: number, tag: string) => buf.toString('latin1', at, at + tag.length) === tag;

/** Keeps only segments that say how to decode the pixels; throws on a file that is not a well-formed JPEG. */
export function stripJpegMetadata(jpeg: Buffer): Buffer {
  if (jpeg.length < 4 || jpeg[0] !== 0xff || jpeg[1] !== SOI) throw new Error('not a JPEG');
  const parts: Buffer[] = [jpeg.subarray(0, 2)];
  let at = 2;
  while (at < jpeg.length) {
    if (jpeg[at] !== 0xff) throw new Error(`no marker at byte ${at}`);
    const marker = jpeg[at + 1]!;
    if (marker === 0xff) {
      at += 1; // fill byte
      continue;
    }
    if (marker === SOS) {
      parts.push(jpeg.subarray(at)); // the scans, their tables and EOI: the image itself
      return Buffer.concat(parts);
    }
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      parts.push(jpeg.subarray(at, at + 2));
      at += 2;
      continue;
    }
    if (at + 4 > jpeg.length) throw new Error('cut short');
    const length = jpeg.readUInt16BE(at + 2);
    const end = at + 2 + length;
    if (length < 2 || end > jpeg.length) throw new Error('segment runs past the end');
    const body = at + 4;
    const keep =
      marker < 0xe0 || marker > 0xef
        ? marker !== COM
        : (marker === 0xe0 && startsWith(jpeg, body, 'JFIF\0')) ||
          (marker === 0xe2 && startsWith(jpeg, body, 'ICC_PROFILE\0')) ||
          (marker === 0xee && startsWith(jpeg, body, 'Adobe'));
    if (keep) parts.push(jpeg.subarray(at, end));
    at = end;
  }
  throw new Error('no image data (SOS)');
}
