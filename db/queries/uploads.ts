// Uploaded scans and photos; the same file (SHA-256) is stored once per series.
import { randomUUID } from 'node:crypto';
import { type Kysely, type Selectable, sql } from 'kysely';
import type { Database, UploadsTable } from '../database';
import { keptQuery } from '../kept-query';

const COLS = ['id', 'name', 'mime', 'bytes', 'width', 'height', 'sha256', 'createdAt'] as const;
/** An upload as the API shows it: its row without the storage keys. */
export type UploadDto = Pick<Selectable<UploadsTable>, (typeof COLS)[number]>;

/** An upload as listed, with how many passes place it now (deleting those asks first). */
export type UploadListItem = UploadDto & { passesUsing: number };

export async function listUploads(db: Kysely<Database>, seriesId: string): Promise<UploadListItem[]> {
  const rows = await db
    .selectFrom('uploads as u')
    .select(COLS.map((c) => `u.${c}` as const))
    .select(sql<number>`(select count(distinct l.pass_id) from lightboxes l where l.upload_id = u.id and l.removed_seq is null)`.as('passesUsing'))
    .where('u.seriesId', '=', seriesId)
    .orderBy('u.createdAt', 'desc')
    .execute();
  return rows.map((r) => ({ ...r, passesUsing: Number(r.passesUsing ?? 0) }));
}

export async function findUploadBySha(db: Kysely<Database>, seriesId: string, sha256: string): Promise<UploadDto | undefined> {
  return db.selectFrom('uploads').select(COLS).where('seriesId', '=', seriesId).where('sha256', '=', sha256).executeTakeFirst();
}

export async function uploadKeys(db: Kysely<Database>, id: string) {
  return db.selectFrom('uploads').select(['seriesId', 'originalKey', 'workingKey', 'previewKey', 'mime']).where('id', '=', id).executeTakeFirst();
}

const uploadSeries = keptQuery((db, id: string) => db.selectFrom('uploads').select('seriesId').where('id', '=', id));

export async function seriesOfUpload(db: Kysely<Database>, id: string): Promise<string | null> {
  const [row] = await uploadSeries(db, id);
  return row?.seriesId ?? null;
}

/** Which of these upload ids belong to the series. */
export async function uploadsInSeries(db: Kysely<Database>, seriesId: string, ids: string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const rows = await db.selectFrom('uploads').select('id').where('seriesId', '=', seriesId).where('id', 'in', ids).execute();
  return new Set(rows.map((r) => r.id));
}

/** Passes whose current state places this upload as a lightbox. */
export async function passesUsingUpload(
  db: Kysely<Database>,
  uploadId: string,
): Promise<{ passId: string; gagId: string; gagTitle: string; passNumber: number }[]> {
  return db
    .selectFrom('lightboxes as l')
    .innerJoin('passes as p', 'p.id', 'l.passId')
    .innerJoin('gags as g', 'g.id', 'p.gagId')
    .select(['p.id as passId', 'g.id as gagId', 'g.title as gagTitle', 'p.number as passNumber'])
    .distinct()
    .where('l.uploadId', '=', uploadId)
    .where('l.removedSeq', 'is', null)
    .orderBy('g.title')
    .orderBy('p.number')
    .execute();
}

export async function insertUpload(db: Kysely<Database>, u: Omit<Database['uploads'], 'id' | 'createdAt'>): Promise<UploadDto> {
  const id = randomUUID();
  await db
    .insertInto('uploads')
    .values({ ...u, id, createdAt: new Date().toISOString() })
    .execute();
  return await db.selectFrom('uploads').select(COLS).where('id', '=', id).executeTakeFirstOrThrow();
}

export async function deleteUpload(db: Kysely<Database>, id: string): Promise<void> {
  await db.deleteFrom('uploads').where('id', '=', id).execute();
}
