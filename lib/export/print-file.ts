// What the print file and the cover file are made of, gathered from the database,
// and their building into object storage (in a worker thread: lib/workers/heavy-worker.ts).
import 'server-only';
import { randomUUID } from 'node:crypto';
import { rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { fitOf } from '@/db/queries/final-pages';
import { passState } from '@/db/queries/passes';
import type { PrintKind } from '@/db/queries/print-jobs';
import { blankSuggestion, blanksNeeded, bookSpineMm } from '@/lib/print/book';
import { entryLabel } from '@/lib/print/matter';
import { Refused } from '@/lib/refused';
import { getObjectToFile, putObjectFile } from '@/lib/storage/s3';
import { type PrintArt, type PrintPage, coverPdf, printPdf } from './print-pdf';
import { volumeArt } from './volume-preflight';

type Art = PrintArt & { keptKey: string };
type FinalRow = NonNullable<ReturnType<Awaited<ReturnType<typeof volumeArt>>['finalOf']>>;

const artOf = (r: FinalRow): Art => ({
  id: r.id,
  mime: r.keptMime as Art['mime'],
  width: r.width,
  height: r.height,
  bitsPerPixel: r.bitsPerPixel,
  fit: fitOf(r),
  keptKey: r.keptKey,
});

/** Pages that need art and have none (a blank matter page needs none), by number. */
export type Missing = { number: number; label: string }[];

/** Why a print file cannot be made now (409 with the pages), or null. */
export async function printBlockers(db: Kysely<Database>, volumeId: string, kind: PrintKind): Promise<{ missing: Missing; message: string } | null> {
  const { volume, entries, finalOf } = await volumeArt(db, volumeId);
  if (kind === 'cover') {
    if (volume.spec.binding !== 'perfect') {
      throw new Refused(422, 'A saddle-stitched book has no separate cover file: its cover pages are in the print file.');
    }
    const missing = (['cover', 'back-cover'] as const).flatMap((k) => {
      const i = entries.findIndex((e) => e.kind === k);
      return i >= 0 && finalOf(entries[i]!) ? [] : [{ number: i + 1, label: k === 'cover' ? 'Cover' : 'Back cover' }];
    });
    return missing.length
      ? {
          missing,
          message: `The cover file needs the cover and back cover pages in the running order, each with a final page: ${missing.map((m) => m.label.toLowerCase()).join(' and ')} missing.`,
        }
      : null;
  }
  if (!entries.length) return { missing: [], message: 'The running order is empty.' };
  const missing = entries.flatMap((e, i) => (e.kind !== 'blank' && !finalOf(e) ? [{ number: i + 1, label: entryLabel(e) }] : []));
  return missing.length
    ? {
        missing,
        message: `${missing.length === 1 ? 'Page' : 'Pages'} ${missing.map((m) => m.number).join(', ')} ${missing.length === 1 ? 'has' : 'have'} no final page yet. Upload ${missing.length === 1 ? 'it' : 'them'}, or ask for a proof.`,
      }
    : null;
}

/** The interior's pages in book order: the running order, with the blanks the binding needs after the suggested page. */
async function interior(db: Kysely<Database>, volumeId: string, proof: boolean) {
  const { volume, entries, finalOf } = await volumeArt(db, volumeId);
  const pages: (PrintPage & { art: Art | null })[] = [];
  for (const e of entries) {
    const row = finalOf(e);
    let standIn: PrintPage['standIn'] = null;
    if (!row && proof && e.kind === 'gag' && e.latestPass) {
      const state = await passState(db, e.latestPass.id);
      if (state) standIn = { passNumber: state.number, strokes: state.strokes, rooms: state.rooms };
    }
    pages.push({ number: 0, label: entryLabel(e), art: row ? artOf(row) : null, standIn });
  }
  const blanks = blanksNeeded(entries.length, volume.spec.binding);
  const after = blankSuggestion(entries.map((e) => e.kind));
  pages.splice(after, 0, ...Array.from({ length: blanks }, () => ({ number: 0, label: 'Blank page', addedBlank: true, art: null })));
  pages.forEach((p, i) => (p.number = i + 1));
  return { volume, entries, pages };
}

export type PrintProgress = { done: number; total: number; stage: string };
export type PrintResult = { objectKey: string; bytes: number; pages: number; notes: string[] };

/** Builds the file into a temporary file, then object storage. */
export async function buildPrintFile(
  db: Kysely<Database>,
  job: { id: string; volumeId: string; kind: PrintKind; proof: boolean },
  progress: (p: PrintProgress) => void,
): Promise<PrintResult> {
  progress({ done: 0, total: 0, stage: 'Gathering the pages' });
  const work = path.join(tmpdir(), `quadrille-print-${randomUUID()}`);
  const file = `${work}.pdf`;
  const fetchScan = async (art: PrintArt) => {
    const local = `${work}-${art.id}`;
    if (!(await getObjectToFile((art as Art).keptKey, local))) throw new Error(`The scan of final page ${art.id} is missing from storage.`);
    return { path: local, done: () => rm(local, { force: true }) };
  };
  const onProgress = (done: number, total: number) => progress({ done, total, stage: `Placing the scans at their own pixels: ${done} of ${total}` });
  try {
    const { volume, entries, pages } = await interior(db, job.volumeId, job.proof);
    const input = { spec: volume.spec, title: volume.title, proof: job.proof, fetchScan, onProgress };
    let result: { bytes: number; notes: string[] };
    let count: number;
    if (job.kind === 'cover') {
      const art = (await volumeArt(db, job.volumeId)).finalOf;
      const find = (k: string) => {
        const e = entries.find((x) => x.kind === k);
        const row = e ? art(e) : null;
        return row ? artOf(row) : null;
      };
      const spineMm = bookSpineMm(pages.length, volume.spec.binding, volume.spec.caliperUm) ?? 0;
      result = await coverPdf({ front: find('cover'), back: find('back-cover'), spineMm, direction: volume.spec.direction }, input, file);
      count = 1;
    } else {
      result = await printPdf(pages, input, file);
      count = pages.length;
    }
    progress({ done: 0, total: 0, stage: 'Storing the file' });
    const objectKey = `volumes/${job.volumeId}/print-jobs/${job.id}/${job.kind}${job.proof ? '-proof' : ''}.pdf`;
    await putObjectFile(objectKey, file, 'application/pdf');
    return { objectKey, bytes: (await stat(file)).size, pages: count, notes: result.notes };
  } finally {
    await rm(file, { force: true });
  }
}
