// Checks and prepares an uploaded scan or photo (server side, sharp):
// recognised by its bytes, upright from its EXIF orientation, metadata stripped
// (location included), a working copy (longest side ≤ 4096 px) and a preview.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import { fileTypeFromBuffer, fileTypeFromFile } from 'file-type';
import sharp from 'sharp';
import { Refused } from '@/lib/refused';

export const MAX_UPLOAD_BYTES = 25 * 1024 * 1024;
export const MAX_PIXELS = 50_000_000;
export const WORKING_MAX_SIDE = 4096;
export const PREVIEW_MAX_SIDE = 320;
export const ACCEPTED = { 'image/png': 'png', 'image/jpeg': 'jpeg', 'image/webp': 'webp' } as const;
export type AcceptedMime = keyof typeof ACCEPTED;

export type Prepared = {
  sha256: string;
  mime: AcceptedMime;
  bytes: number;
  width: number;
  height: number;
  original: Buffer;
  working: Buffer;
  preview: Buffer;
};

async function sha256Of(input: Buffer | string): Promise<string> {
  const hash = createHash('sha256');
  if (typeof input !== 'string') return hash.update(input).digest('hex');
  for await (const chunk of createReadStream(input)) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

/** Prepares an upload given as bytes or as the path of a received file (read from disk, never whole into memory by us). */
export async function prepareUpload(input: Buffer | string): Promise<Prepared> {
  const size = typeof input === 'string' ? (await stat(input)).size : input.byteLength;
  if (size > MAX_UPLOAD_BYTES) throw new Refused(413, `The file is over 25 MB (${(size / 1048576).toFixed(1)} MB).`);
  const type = typeof input === 'string' ? await fileTypeFromFile(input) : await fileTypeFromBuffer(input);
  if (!type || !(type.mime in ACCEPTED)) {
    throw new Refused(415, `Only PNG, JPEG and WebP images can be used${type ? ` (this file is ${type.mime})` : ''}.`);
  }
  const mime = type.mime as AcceptedMime;
  const format = ACCEPTED[mime];
  let meta: Awaited<ReturnType<ReturnType<typeof sharp>['metadata']>>;
  try {
    meta = await sharp(input, { limitInputPixels: false }).metadata();
  } catch {
    throw new Refused(422, 'The image is damaged and cannot be read.');
  }
  if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_PIXELS) {
    throw new Refused(413, `The image is ${meta.width} × ${meta.height} px, over 50 megapixels.`);
  }
  const base = () => sharp(input, { limitInputPixels: MAX_PIXELS, failOn: 'error' }).rotate(); // EXIF orientation applied; no metadata kept
  try {
    const original = await base()
      .toFormat(format, format === 'png' ? {} : { quality: 95 })
      .toBuffer({ resolveWithObject: true });
    const working = await base()
      .resize({ width: WORKING_MAX_SIDE, height: WORKING_MAX_SIDE, fit: 'inside', withoutEnlargement: true })
      .toFormat(format, format === 'png' ? {} : { quality: 90 })
      .toBuffer();
    const preview = await base()
      .resize({ width: PREVIEW_MAX_SIDE, height: PREVIEW_MAX_SIDE, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 80 })
      .toBuffer();
    return {
      sha256: await sha256Of(input),
      mime,
      bytes: size,
      width: original.info.width,
      height: original.info.height,
      original: original.data,
      working,
      preview,
    };
  } catch (err) {
    if (err instanceof Refused) throw err;
    throw new Refused(422, 'The image is damaged and cannot be read.');
  }
}
