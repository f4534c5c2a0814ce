// Checks and keeps an uploaded final page (server side, sharp): recognised by its
// bytes (TIFF, PNG, JPEG), its pixels kept as they came — no resize, no lossy step:
// - a JPEG that is already upright is kept byte for byte but for its metadata
//   segments (lib/uploads/jpeg-strip.ts): the compressed image is the same file;
// - anything else is turned upright by sharp (a quarter turn moves pixels, never
//   resamples them) and kept as a lossless TIFF at its own bit depth: 1-bit as CCITT
//   group 4, 8- and 16-bit grey and colour deflated, the resolution (ppi) and ICC
//   profile carried over, every other tag (Exif, GPS, XMP, IPTC) left behind.
// Beside it: a copy at most 2,048 px for the screen and a 320 px preview.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { readFile, rm, stat, writeFile } from 'node:fs/promises';
import { fileTypeFromFile } from 'file-type';
import sharp from 'sharp';
import type { FinalPageColour } from '@/db/database';
import { Refused } from '@/lib/refused';
import { stripJpegMetadata } from './jpeg-strip';

export const FINAL_MAX_BYTES = 100 * 1024 * 1024;
export const FINAL_MAX_PIXELS = 150_000_000;
export const DISPLAY_MAX_SIDE = 2048;
export const PREVIEW_MAX_SIDE = 320;
export const FINAL_ACCEPTED = ['image/tiff', 'image/png', 'image/jpeg'] as const;
export type FinalMime = (typeof FINAL_ACCEPTED)[number];

/**
 * A grey scan counts as line art ("near 1-bit") when at least this share of its pixels
 * is near black (≤ 32) or near white (≥ 223): ink on paper with no tone between. Our
 * rule of thumb, measured on a nearest-neighbour reduction so no grey is made up.
 */
export const NEAR_LINE_SHARE = 0.98;

export type PreparedFinal = {
  sha256: string;
  mime: FinalMime;
  bytes: number;
  width: number;
  height: number;
  bitsPerPixel: number;
  colour: FinalPageColour;
  ppi: number | null;
  /** The kept file on disk (a temporary file), to stream to storage. */
  kept: { path: string; mime: 'image/tiff' | 'image/jpeg'; ext: 'tif' | 'jpg' };
  display: { data: Buffer; mime: 'image/png' | 'image/jpeg'; ext: 'png' | 'jpg' };
  preview: Buffer;
  discard: () => Promise<void>;
};

async function sha256Of(file: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(file)) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

const damaged = () => new Refused(422, 'The image is damaged and cannot be read.');

/** Share of near-black or near-white pixels, on a reduction that only picks pixels (never blends them). */
async function nearLineShare(file: string): Promise<number> {
  const { data } = await sharp(file, { limitInputPixels: FINAL_MAX_PIXELS })
    .resize(1024, 1024, { fit: 'inside', kernel: 'nearest', withoutEnlargement: true })
    .flatten({ background: '#ffffff' })
    .toColourspace('b-w')
    .raw()
    .toBuffer({ resolveWithObject: true });
  let extreme = 0;
  for (const v of data) if (v <= 32 || v >= 223) extreme++;
  return extreme / data.length;
}

/** Prepares a received final page (a file on disk). Throws Refused 413/415/422 and keeps nothing then. */
export async function prepareFinalPage(file: string): Promise<PreparedFinal> {
  const size = (await stat(file)).size;
  if (size > FINAL_MAX_BYTES) throw new Refused(413, `The file is over ${FINAL_MAX_BYTES / 1048576} MB (${(size / 1048576).toFixed(1)} MB).`);
  const type = await fileTypeFromFile(file);
  if (!type || !(FINAL_ACCEPTED as readonly string[]).includes(type.mime)) {
    throw new Refused(415, `A final page is a TIFF, PNG or JPEG scan${type ? ` (this file is ${type.mime})` : ''}.`);
  }
  const mime = type.mime as FinalMime;
  let meta: Awaited<ReturnType<ReturnType<typeof sharp>['metadata']>>;
  try {
    meta = await sharp(file, { limitInputPixels: false }).metadata();
  } catch {
    throw damaged();
  }
  const width = meta.autoOrient?.width ?? meta.width ?? 0;
  const height = meta.autoOrient?.height ?? meta.height ?? 0;
  if (!width || !height) throw damaged();
  if (width * height > FINAL_MAX_PIXELS) throw new Refused(413, `The image is ${width} × ${height} px, over ${FINAL_MAX_PIXELS / 1e6} megapixels.`);
  const bitsPerSample = meta.bitsPerSample ?? (meta.depth === 'ushort' ? 16 : 8);
  const channels = meta.channels ?? 1;
  const colourChannels = channels - (meta.hasAlpha ? 1 : 0);
  const bitsPerPixel = bitsPerSample * channels;
  let ppi = meta.density && meta.density > 0 ? meta.density : null;

  const kept = `${file}.kept`;
  const discard = () => rm(kept, { force: true });
  try {
    let colour: FinalPageColour;
    if (colourChannels >= 3) colour = 'rgb';
    else if (bitsPerSample === 1) colour = 'line';
    else colour = (await nearLineShare(file)) >= NEAR_LINE_SHARE ? 'line' : 'grey';

    let keptAs: PreparedFinal['kept'];
    if (mime === 'image/jpeg' && (meta.orientation ?? 1) === 1) {
      const stripped = stripJpegMetadata(await readFile(file));
      await sharp(stripped, { failOn: 'error' }).stats(); // decodes it whole: a damaged file stops here
      const jfif = (await sharp(stripped).metadata()).density; // the JFIF header's, now that Exif's is gone
      ppi = jfif && jfif > 0 ? jfif : null;
      await writeFile(kept, stripped);
      keptAs = { path: kept, mime: 'image/jpeg', ext: 'jpg' };
    } else {
      let pipe = sharp(file, { limitInputPixels: FINAL_MAX_PIXELS, failOn: 'error' }).rotate().keepIccProfile();
      if (colourChannels === 1) pipe = pipe.toColourspace(bitsPerSample === 16 ? 'grey16' : 'b-w');
      else if (bitsPerSample === 16) pipe = pipe.toColourspace('rgb16');
      const res = ppi ? { xres: ppi / 25.4, yres: ppi / 25.4 } : {}; // TIFF resolution in pixels per mm (libvips)
      await (
        bitsPerSample === 1 && colourChannels === 1
          ? pipe.tiff({ compression: 'ccittfax4', bitdepth: 1, ...res })
          : pipe.tiff({ compression: 'deflate', predictor: 'horizontal', ...res })
      ).toFile(kept);
      keptAs = { path: kept, mime: 'image/tiff', ext: 'tif' };
    }

    const screen = () =>
      sharp(file, { limitInputPixels: FINAL_MAX_PIXELS })
        .rotate()
        .flatten({ background: '#ffffff' })
        .resize(DISPLAY_MAX_SIDE, DISPLAY_MAX_SIDE, { fit: 'inside', withoutEnlargement: true });
    const display: PreparedFinal['display'] =
      colour === 'rgb'
        ? { data: await screen().jpeg({ quality: 85 }).toBuffer(), mime: 'image/jpeg', ext: 'jpg' }
        : { data: await screen().toColourspace('b-w').png().toBuffer(), mime: 'image/png', ext: 'png' };
    const preview = await sharp(display.data)
      .resize(PREVIEW_MAX_SIDE, PREVIEW_MAX_SIDE, { fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 80 })
      .toBuffer();
    return { sha256: await sha256Of(file), mime, bytes: size, width, height, bitsPerPixel, colour, ppi, kept: keptAs, display, preview, discard };
  } catch (err) {
    await discard();
    if (err instanceof Refused) throw err;
    throw damaged();
  }
}
