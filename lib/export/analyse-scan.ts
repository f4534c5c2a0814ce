// Measures a final page's kept scan for the preflight (lib/print/scan-analysis.ts): the
// file comes from object storage to a temporary file, and sharp hands its pixels over
// as a stream of raw rows, so memory stays small whatever the scan's size. Runs in a
// worker thread (lib/workers/heavy-worker.ts#analyseFinalPage).
import { randomUUID } from 'node:crypto';
import { rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { ScanAnalyser, type ScanAnalysis } from '@/lib/print/scan-analysis';
import { getObjectToFile } from '@/lib/storage/s3';
import { FINAL_MAX_PIXELS } from '@/lib/uploads/final-page';

/** The scan's pixels as 8-bit rows: grey (one channel) or sRGB (three), flattened on white paper. */
export async function rawRows(file: string) {
  const meta = await sharp(file, { limitInputPixels: FINAL_MAX_PIXELS }).metadata();
  const colour = (meta.channels ?? 1) - (meta.hasAlpha ? 1 : 0) >= 3;
  const pipe = sharp(file, { limitInputPixels: FINAL_MAX_PIXELS })
    .flatten({ background: '#ffffff' })
    .toColourspace(colour ? 'srgb' : 'b-w')
    .raw({ depth: 'uchar' });
  return { width: meta.width!, height: meta.height!, channels: (colour ? 3 : 1) as 1 | 3, stream: pipe };
}

export async function analyseFile(file: string): Promise<ScanAnalysis> {
  const { width, height, channels, stream } = await rawRows(file);
  const a = new ScanAnalyser(width, height, channels);
  for await (const chunk of stream) a.push(chunk as Buffer);
  return a.result();
}

export async function analyseKept(keptKey: string): Promise<ScanAnalysis | null> {
  const file = path.join(tmpdir(), `quadrille-analyse-${randomUUID()}`);
  try {
    if (!(await getObjectToFile(keptKey, file))) return null;
    return await analyseFile(file);
  } finally {
    await rm(file, { force: true });
  }
}
