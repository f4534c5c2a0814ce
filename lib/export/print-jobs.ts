// Starting a print job on this instance and following any job from any instance.
// The job's row is the truth every instance reads; the work runs in this process's
// worker pool, and this (request) thread writes the worker's progress to the row,
// beating the heartbeat every few seconds while a long page is encoded.
import 'server-only';
import { MessageChannel } from 'node:worker_threads';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import {
  type PrintJobDto,
  type PrintKind,
  failPrintJob,
  findPrintJob,
  finishPrintJob,
  reportProgress,
  retireOldPrintFiles,
  startPrintJob,
} from '@/db/queries/print-jobs';
import { Refused } from '@/lib/refused';
import { deleteObject } from '@/lib/storage/s3';
import { runHeavyTransferring } from '@/lib/workers/pool';
import { type PrintProgress, printBlockers } from './print-file';

/** How often a running job's row is written at most, and at least (the heartbeat). */
const PROGRESS_EVERY_MS = 500;
const HEARTBEAT_EVERY_MS = 10_000;

/**
 * Starts (or joins) a print or cover job for a volume. Refuses 409 with the pages
 * that have no final art yet, unless it is a proof.
 */
export async function requestPrintFile(
  db: Kysely<Database>,
  input: { volumeId: string; kind: PrintKind; proof: boolean; userId: string },
): Promise<{ job: PrintJobDto; blocked?: undefined } | { blocked: Response; job?: undefined }> {
  const blocked = await printBlockers(db, input.volumeId, input.kind);
  // An empty running order cannot make even a proof.
  if (blocked && (!input.proof || !blocked.missing.length)) {
    return { blocked: Response.json({ error: blocked.message, missing: blocked.missing }, { status: 409 }) };
  }
  const { job, started } = await startPrintJob(db, input);
  if (started) void build(db, job);
  return { job };
}

async function build(db: Kysely<Database>, job: PrintJobDto) {
  const channel = new MessageChannel();
  let last: PrintProgress = { done: 0, total: 0, stage: 'Starting' };
  let written = 0;
  let writing: Promise<void> = Promise.resolve();
  const write = () => {
    written = Date.now();
    const p = last;
    writing = writing.then(() => reportProgress(db, job.id, p)).catch(() => undefined);
  };
  channel.port1.on('message', (p: PrintProgress) => {
    last = p;
    if (Date.now() - written >= PROGRESS_EVERY_MS) write();
  });
  const beat = setInterval(write, HEARTBEAT_EVERY_MS);
  beat.unref();
  try {
    write();
    const result = await runHeavyTransferring(
      'printFile',
      { job: { id: job.id, volumeId: job.volumeId, kind: job.kind, proof: job.proof }, port: channel.port2 },
      [channel.port2],
    );
    clearInterval(beat);
    await writing;
    await finishPrintJob(db, job.id, result);
    await retireOldFiles(db, job);
  } catch (err) {
    clearInterval(beat);
    await writing;
    const message = err instanceof Refused ? err.message : 'Building the file failed on the server; try again, and tell us if it fails again.';
    if (!(err instanceof Refused)) console.error('print job failed', job.id, err);
    await failPrintJob(db, job.id, message).catch(() => undefined);
  } finally {
    channel.port1.close();
  }
}

/** The files this job's newer one replaces leave storage (the rows first, so none names a missing file). */
export async function retireOldFiles(db: Kysely<Database>, job: PrintJobDto): Promise<void> {
  try {
    for (const key of await retireOldPrintFiles(db, job)) await deleteObject(key);
  } catch (err) {
    // The new file stands; an old one left in storage is only space.
    console.error('print job: could not remove older files', job.id, err);
  }
}

/** Waits for a job (built on this instance or another) to finish: the row says when. */
export async function waitForPrintJob(db: Kysely<Database>, id: string, timeoutMs = 30 * 60_000): Promise<PrintJobDto> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const job = await findPrintJob(db, id);
    if (!job || job.state === 'done' || job.state === 'failed' || Date.now() > until) return job!;
    await new Promise((r) => setTimeout(r, 250));
  }
}
