// The review PDF's speed, measured side by side in one run: the export itself, and a
// floor — bare pdf-lib writing the same outline paths as one content stream per page
// (no boxes, panels, clips, texts or font), with the export's own path writer and
// compression, so the ratio is what everything else on the page costs. Every page has
// strokes of its own (40, of 60 points), so nothing computed for one page helps another.
import { PDFDocument, PDFName } from 'pdf-lib';
import { ContentWriter, type ReviewPage, reviewPdf, strokeSpace, writeStrokePaths } from '@/lib/export/pdf';
import { DEFAULT_VOLUME_SPEC, pdfBoxes } from '@/lib/print/book';
import { outlineOf } from '@/lib/strokes/outline';
import type { Stroke } from '@/lib/strokes/types';
import { benchStrokes } from './strokes-fixture';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

export const STROKES_A_PAGE = 40;

const gagPages = (n: number): ReviewPage[] =>
  Array.from({ length: n }, (_, i) => ({
    number: i + 1,
    kind: 'gag',
    label: `Gag ${i + 1}`,
    strokes: benchStrokes(STROKES_A_PAGE, 1000 + i),
    rooms: [],
  }));

/** The floor: one page per page, one content stream each holding the strokes' outline paths, nothing else. */
async function floorPdf(pages: ReviewPage[]): Promise<Uint8Array> {
  const spec = DEFAULT_VOLUME_SPEC;
  const doc = await PDFDocument.create();
  const [, , w, h] = pdfBoxes(spec).media;
  const tone = { name: PDFName.of('T'), ref: doc.context.register(doc.context.obj({ Type: 'ExtGState', ca: 0.55, CA: 0.55 })) };
  const out = new ContentWriter();
  for (const p of pages) {
    const page = doc.addPage([w, h]);
    page.node.setExtGState(tone.name, tone.ref);
    out.text(strokeSpace(spec, h));
    writeStrokePaths(out, p.strokes!, () => tone.name);
    out.finish(doc, page);
  }
  return doc.save();
}

/** Wall-clock and CPU time (this process, all its threads) of one run, in ms. */
type Timing = { wall: number; cpu: number };

async function timed(fn: () => Promise<unknown>): Promise<Timing> {
  const cpu = process.cpuUsage();
  const t = performance.now();
  await fn();
  const wall = performance.now() - t;
  const used = process.cpuUsage(cpu);
  return { wall, cpu: (used.user + used.system) / 1000 };
}

export type PdfFigures = {
  /** Whole review PDFs of 12 and 120 gag pages, wall-clock, and the ratio of their CPU times (medians). */
  pdf12Ms: number;
  pdf120Ms: number;
  linearRatio: number;
  /** The 120-page PDF a page and the floor's, wall-clock; the ratio of their CPU times (medians); the outlines alone a page. */
  pageMs: number;
  floorPageMs: number;
  floorRatio: number;
  outlinePageMs: number;
  rounds: number;
};

const ROUNDS = 15;

/**
 * The ratios compare CPU time (this process's, GC threads included): on a machine shared with other
 * work (two cores here), wall-clock time also counts the moments another process had the core, which
 * fall unevenly on the two sides. The ms a page, what a person waits, is wall-clock. Each figure is the
 * median of its runs, taken in rounds side by side.
 */
export async function pdfFigures(): Promise<PdfFigures> {
  const pages12 = gagPages(12);
  const pages120 = gagPages(120);
  const ours = (pages: ReviewPage[]) => reviewPdf(DEFAULT_VOLUME_SPEC, 'Bench', pages);
  // Warm-up (module loading, the font, JIT) for both.
  for (let i = 0; i < 2; i++) {
    await ours(pages12);
    await floorPdf(pages12);
  }
  const pdf12: Timing[] = [];
  const pdf120: Timing[] = [];
  const floor120: Timing[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    // The 12-page document is short: three runs a round.
    for (let k = 0; k < 3; k++) pdf12.push(await timed(() => ours(pages12)));
    // Which of the two goes first alternates from round to round.
    if (round % 2) floor120.push(await timed(() => floorPdf(pages120)));
    pdf120.push(await timed(() => ours(pages120)));
    if (round % 2 === 0) floor120.push(await timed(() => floorPdf(pages120)));
  }
  const outlines: Timing[] = [];
  const all: Stroke[] = pages120.flatMap((p) => p.strokes!);
  for (let round = 0; round < 3; round++) outlines.push(await timed(async () => all.forEach((s) => outlineOf(s))));
  const wall = (xs: Timing[]) => median(xs.map((x) => x.wall));
  const cpu = (xs: Timing[]) => median(xs.map((x) => x.cpu));
  return {
    pdf12Ms: wall(pdf12),
    pdf120Ms: wall(pdf120),
    linearRatio: cpu(pdf120) / cpu(pdf12),
    pageMs: wall(pdf120) / 120,
    floorPageMs: wall(floor120) / 120,
    floorRatio: cpu(pdf120) / cpu(floor120),
    outlinePageMs: wall(outlines) / 120,
    rounds: ROUNDS,
  };
}
