// Print-file jobs: one row each, read alike by every instance. The instance that
// builds a job writes its progress (which also beats its heartbeat); a job whose
// heartbeat has stopped for HEARTBEAT_LOST_MS reads as failed, so a server that went
// away mid-build never leaves a progress bar standing still on the other instances.
import { randomUUID } from 'node:crypto';
import type { Kysely, Selectable } from 'kysely';
import type { Database, PrintJobsTable } from '../database';
import { lockRow } from '../dialect';
import { keptQuery } from '../kept-query';

type Row = Selectable<PrintJobsTable>;
export type PrintKind = PrintJobsTable['kind'];

/** A job still queued or running with no heartbeat for this long is taken as lost (its server stopped). */
export const HEARTBEAT_LOST_MS = 60_000;

export type PrintJobDto = {
  id: string;
  volumeId: string;
  kind: PrintKind;
  proof: boolean;
  state: Row['state'];
  done: number;
  total: number;
  stage: string;
  message: string | null;
  notes: string[];
  bytes: number | null;
  pages: number | null;
  by: string;
  createdAt: string;
  finishedAt: string | null;
  /** Where the finished file is downloaded (members only). */
  file: string | null;
};

const LOST = 'The server building this file stopped before it finished; start it again.';

function toDto(r: Row & { byName: string }, now = Date.now()): PrintJobDto {
  const lost = (r.state === 'queued' || r.state === 'running') && now - r.heartbeatAt > HEARTBEAT_LOST_MS;
  return {
    id: r.id,
    volumeId: r.volumeId,
    kind: r.kind,
    proof: r.proof === 1,
    state: lost ? 'failed' : r.state,
    done: r.done,
    total: r.total,
    stage: r.stage,
    message: lost ? LOST : r.message,
    notes: JSON.parse(r.notes) as string[],
    bytes: r.bytes,
    pages: r.pages,
    by: r.byName,
    createdAt: r.createdAt,
    finishedAt: r.finishedAt,
    file: r.state === 'done' && r.objectKey ? `/api/print-jobs/${r.id}/file` : null,
  };
}

function rows(db: Kysely<Database>) {
  return db.selectFrom('printJobs as j').innerJoin('users as u', 'u.id', 'j.requestedBy').selectAll('j').select('u.name as byName');
}

export async function findPrintJob(db: Kysely<Database>, id: string): Promise<PrintJobDto | undefined> {
  const r = await rows(db).where('j.id', '=', id).executeTakeFirst();
  return r && toDto(r);
}

/** The object key of a finished job's file. */
export async function printJobFile(
  db: Kysely<Database>,
  id: string,
): Promise<{ key: string; kind: PrintKind; proof: boolean; volumeId: string } | null> {
  const r = await db.selectFrom('printJobs').select(['objectKey', 'kind', 'proof', 'volumeId', 'state']).where('id', '=', id).executeTakeFirst();
  return r && r.state === 'done' && r.objectKey ? { key: r.objectKey, kind: r.kind, proof: r.proof === 1, volumeId: r.volumeId } : null;
}

const printJobSeries = keptQuery((db, id: string) =>
  db.selectFrom('printJobs as j').innerJoin('volumes as v', 'v.id', 'j.volumeId').select('v.seriesId').where('j.id', '=', id),
);

export async function seriesOfPrintJob(db: Kysely<Database>, id: string): Promise<string | null> {
  const [r] = await printJobSeries(db, id);
  return r?.seriesId ?? null;
}

/** A volume's latest jobs, newest first. */
export async function listPrintJobs(db: Kysely<Database>, volumeId: string, limit = 6): Promise<PrintJobDto[]> {
  const r = await rows(db).where('j.volumeId', '=', volumeId).orderBy('j.createdAt', 'desc').orderBy('j.id').limit(limit).execute();
  const now = Date.now();
  return r.map((x) => toDto(x, now));
}

/**
 * A new job, or the same kind of job already under way for this volume (a second
 * press of the button, on any instance, joins the first rather than building twice).
 */
export async function startPrintJob(
  db: Kysely<Database>,
  input: { volumeId: string; kind: PrintKind; proof: boolean; userId: string },
): Promise<{ job: PrintJobDto; started: boolean }> {
  const { id, started } = await db.transaction().execute(async (trx) => {
    await lockRow(trx, 'volumes', input.volumeId);
    const running = await trx
      .selectFrom('printJobs')
      .select('id')
      .where('volumeId', '=', input.volumeId)
      .where('kind', '=', input.kind)
      .where('proof', '=', input.proof ? 1 : 0)
      .where('state', 'in', ['queued', 'running'])
      .where('heartbeatAt', '>', Date.now() - HEARTBEAT_LOST_MS)
      .executeTakeFirst();
    if (running) return { id: running.id, started: false };
    const id = randomUUID();
    await trx
      .insertInto('printJobs')
      .values({
        id,
        volumeId: input.volumeId,
        kind: input.kind,
        proof: input.proof ? 1 : 0,
        state: 'queued',
        stage: 'Waiting for a free worker',
        requestedBy: input.userId,
        createdAt: new Date().toISOString(),
        heartbeatAt: Date.now(),
      })
      .execute();
    return { id, started: true };
  });
  return { job: (await findPrintJob(db, id))!, started };
}

export type JobProgress = { done: number; total: number; stage: string };

/** Progress, and the heartbeat that says the job's server is alive. */
export async function reportProgress(db: Kysely<Database>, id: string, p: JobProgress): Promise<void> {
  await db
    .updateTable('printJobs')
    .set({ state: 'running', done: p.done, total: p.total, stage: p.stage, heartbeatAt: Date.now() })
    .where('id', '=', id)
    .where('state', 'in', ['queued', 'running'])
    .execute();
}

export async function finishPrintJob(
  db: Kysely<Database>,
  id: string,
  result: { objectKey: string; bytes: number; pages: number; notes: string[] },
): Promise<void> {
  await db
    .updateTable('printJobs')
    .set({
      state: 'done',
      done: result.pages,
      total: result.pages,
      stage: 'Ready',
      objectKey: result.objectKey,
      bytes: result.bytes,
      pages: result.pages,
      notes: JSON.stringify(result.notes),
      heartbeatAt: Date.now(),
      finishedAt: new Date().toISOString(),
    })
    .where('id', '=', id)
    .execute();
}

/** Finished files kept per volume, kind and proof-or-not: the newest, and the few before them to compare. */
export const PRINT_FILES_KEPT = 3;

/**
 * The older finished files of a volume's kind (print or cover, proof or not) beyond the newest
 * PRINT_FILES_KEPT: their rows stop naming them (the job stays listed, without a file) and their
 * keys are returned for the caller to delete from storage once this has committed.
 */
export async function retireOldPrintFiles(db: Kysely<Database>, job: { volumeId: string; kind: PrintKind; proof: boolean }): Promise<string[]> {
  return db.transaction().execute(async (trx) => {
    await lockRow(trx, 'volumes', job.volumeId);
    const done = await trx
      .selectFrom('printJobs')
      .select(['id', 'objectKey'])
      .where('volumeId', '=', job.volumeId)
      .where('kind', '=', job.kind)
      .where('proof', '=', job.proof ? 1 : 0)
      .where('state', '=', 'done')
      .where('objectKey', 'is not', null)
      .orderBy('finishedAt', 'desc')
      .orderBy('id', 'desc')
      .execute();
    const old = done.slice(PRINT_FILES_KEPT);
    if (old.length === 0) return [];
    await trx
      .updateTable('printJobs')
      .set({ objectKey: null, stage: 'Replaced by a newer file' })
      .where(
        'id',
        'in',
        old.map((r) => r.id),
      )
      .execute();
    return old.map((r) => r.objectKey!);
  });
}

export async function failPrintJob(db: Kysely<Database>, id: string, message: string): Promise<void> {
  await db
    .updateTable('printJobs')
    .set({ state: 'failed', message, heartbeatAt: Date.now(), finishedAt: new Date().toISOString() })
    .where('id', '=', id)
    .execute();
}
