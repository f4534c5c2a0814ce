// The print file's cost as the book grows, measured side by side in one run: 12 and 48
// pages of 600 ppi line art (1-bit, the page plus its bleed: 3,685 px square), written
// with the same code the print job runs (lib/export/print-pdf.ts). Time should grow
// linearly (48 ÷ 12 = 4); memory should not grow with the pages, as the scans are
// embedded one at a time. Peak memory is the process's resident set, sampled every 10 ms.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { type PrintPage, printPdf } from '@/lib/export/print-pdf';
import { DEFAULT_VOLUME_SPEC } from '@/lib/print/book';
import { lineArtTiff } from '../support/scans';

export type PrintFigures = { ms12: number; ms48: number; peak12: number; peak48: number; base: number; bytes48: number };

async function run(pages: number, scan: string, dir: string) {
  const spec = DEFAULT_VOLUME_SPEC;
  const side = Math.round(((spec.trimW + 2 * spec.bleed) / 25.4) * 600);
  const list: PrintPage[] = Array.from({ length: pages }, (_, i) => ({
    number: i + 1,
    label: `Gag ${i + 1}`,
    art: { id: `p${i}`, mime: 'image/tiff', width: side, height: side, bitsPerPixel: 1, fit: { to: 'bleed', x: 0, y: 0, scale: 1, rotation: 0 } },
  }));
  global.gc?.();
  let peak = process.memoryUsage().rss;
  const sample = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 10);
  const t = performance.now();
  const out = path.join(dir, `print-${pages}.pdf`);
  const { bytes } = await printPdf(
    list,
    {
      spec,
      title: 'Bench',
      proof: false,
      // Each page reads its own copy of the scan from disk, as the job reads each from storage.
      fetchScan: async (art) => {
        const file = path.join(dir, `${art.id}.tif`);
        fs.copyFileSync(scan, file);
        return { path: file, done: async () => fs.rmSync(file, { force: true }) };
      },
    },
    out,
  );
  const ms = performance.now() - t;
  clearInterval(sample);
  peak = Math.max(peak, process.memoryUsage().rss);
  fs.rmSync(out, { force: true });
  return { ms, peak, bytes };
}

export async function printFigures(): Promise<PrintFigures> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-print-bench-'));
  const spec = DEFAULT_VOLUME_SPEC;
  const w = spec.trimW + 2 * spec.bleed;
  const marks = Array.from({ length: 40 }, (_, i) => ({ x: 10 + (i % 8) * 17, y: 10 + Math.floor(i / 8) * 27, w: 12, h: 0.6 }));
  const scan = path.join(dir, 'scan.tif');
  fs.writeFileSync(scan, await lineArtTiff({ w, h: w, ppi: 600, marks }, 'ccittfax4'));
  await run(2, scan, dir); // warm-up: modules, sharp, zlib
  const base = process.memoryUsage().rss;
  const a = await run(12, scan, dir);
  const b = await run(48, scan, dir);
  fs.rmSync(dir, { recursive: true, force: true });
  return { ms12: a.ms, ms48: b.ms, peak12: a.peak, peak48: b.peak, base, bytes48: b.bytes };
}
