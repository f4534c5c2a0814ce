// The work that takes seconds on a big pass or a long volume, run in a worker
// thread (lib/workers/pool.ts) so the server's request thread stays free: a
// pass's SVG, its readability findings, and the volume PDFs. Each task reads
// what it needs through its own database connection (the process environment
// is shared with the worker) and answers plain data.
import { gzipSync } from 'node:zlib';
import { move } from 'piscina';
import type { Kysely } from 'kysely';
import { DEFAULT_DATABASE_URL, createDb } from '@/db/client';
import type { Database } from '@/db/database';
import { findGag } from '@/db/queries/gags';
import { listPasses, liveStrokesOfPasses, passState } from '@/db/queries/passes';
import { ROOMS, liveItemsOfPasses } from '@/db/queries/pass-items';
import { inkThresholdOf } from '@/db/queries/review';
import { pageSpecForGag, pageSpecForPass } from '@/db/queries/series';
import { findVolume } from '@/db/queries/volumes';
import { type BlueLineOptions, blueLinePdf } from '@/lib/export/blue-lines';
import { reviewPdf as buildReviewPdf } from '@/lib/export/pdf';
import { blueLineGags, scanImages, volumePages } from '@/lib/export/volume-export';
import { computeFindings } from '@/lib/review/findings';
import { passToSvg } from '@/lib/strokes/svg';
import { analyseKept } from '@/lib/export/analyse-scan';
import { buildPrintFile } from '@/lib/export/print-file';
import type { MessagePort } from 'node:worker_threads';

let reader: { url: string; db: Kysely<Database> } | undefined;

/**
 * This thread's own connection, for reading only: it never migrates (the app did at start) and takes no
 * write lock, so a worker slowed by its low priority can never hold up a writer on the request thread.
 */
async function getDb(): Promise<Kysely<Database>> {
  const url = process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
  if (!reader || reader.url !== url) {
    void reader?.db.destroy();
    reader = { url, db: createDb(url, { readOnly: true }) };
  }
  return reader.db;
}

/** Hands the bytes to the request thread without copying them. */
const sent = (bytes: Uint8Array) => move(bytes) as unknown as Uint8Array;

/** Nothing: loading this module is the work (see warmHeavyPool). */
export async function ready() {
  return true;
}

export async function thumbnail(args: { passId: string; seriesId: string }) {
  const db = await getDb();
  const state = await passState(db, args.passId);
  if (!state) return null;
  const spec = await pageSpecForPass(db, args.seriesId, args.passId);
  // Gzipped here and handed over without a copy: a big pass's SVG is tens of MB, and the request thread
  // then only passes a tenth of that to the socket, with no compressing of its own.
  return sent(gzipSync(passToSvg(spec, state.strokes, state.rooms, { bleed: false, title: `Pass ${state.number}` })));
}

export async function findings(args: { passId: string; seriesId: string }) {
  const db = await getDb();
  const state = await passState(db, args.passId);
  const gag = state && (await findGag(db, state.gagId));
  if (!state || !gag) return null;
  const spec = await pageSpecForPass(db, args.seriesId, args.passId);
  const threshold = await inkThresholdOf(db, args.seriesId);
  return { seq: state.seq, findings: computeFindings(spec, state.strokes, state.rooms, gag.beats, threshold) };
}

/** Every pass of a gag as a small SVG page, for the gag page's pass cards and the compare view. */
export async function gagPassSvgs(args: { seriesId: string; gagId: string }) {
  const db = await getDb();
  const spec = await pageSpecForGag(db, args.seriesId, args.gagId);
  const passes = await listPasses(db, args.gagId);
  // Two queries for all the passes, however many there are.
  const ids = passes.map((p) => p.id);
  const strokes = await liveStrokesOfPasses(db, ids);
  const rooms = await liveItemsOfPasses(db, ROOMS, ids);
  const out = passes.map((p) => ({
    id: p.id,
    number: p.number,
    seq: p.seq,
    strokeCount: p.strokeCount,
    updatedAt: p.updatedAt,
    svg: passToSvg(spec, strokes.get(p.id) ?? [], rooms.get(p.id) ?? [], { idPrefix: `pass${p.number}`, title: `Pass ${p.number}` }),
  }));
  return { spec, passes: out };
}

export async function reviewPdf(args: { volumeId: string; lightbox: boolean }) {
  const db = await getDb();
  const { volume, pages } = await volumePages(db, args.volumeId, { lightbox: args.lightbox });
  const bytes = await buildReviewPdf(volume.spec, volume.title, pages, { scans: args.lightbox ? await scanImages(db, pages) : undefined });
  return sent(bytes);
}

/** Blue-line sheets of these gags (in running order; none: one blank template). */
export async function templatesPdf(args: { volumeId: string; gagIds: string[] } & BlueLineOptions) {
  const db = await getDb();
  const { volumeId, gagIds, ...options } = args;
  const volume = (await findVolume(db, volumeId))!;
  return sent(await blueLinePdf(volume.spec, volume.title, await blueLineGags(db, volumeId, gagIds), options));
}

/** Measures a final page's scan for the preflight (colour, ink): seconds for a 600 ppi page, in bounded memory. */
export async function analyseFinalPage(args: { keptKey: string }) {
  return analyseKept(args.keptKey); // two grids of at most 64 KB each: copied to the request thread
}

/**
 * The print file or cover file of a volume, into object storage. Progress goes back over `port`
 * to the request thread, which writes it to the job's row (this thread only reads the database).
 */
export async function printFile(args: { job: { id: string; volumeId: string; kind: 'print' | 'cover'; proof: boolean }; port: MessagePort }) {
  const db = await getDb();
  try {
    return await buildPrintFile(db, args.job, (p) => args.port.postMessage(p));
  } finally {
    args.port.close();
  }
}
