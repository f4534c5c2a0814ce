// Uploaded scans and photos; the same file (SHA-256) is stored once per series.
import { randomUUID } from 'node:crypto';
import type { Kysely } from 'kysely';
import type { Database } from '../database';

export type UploadDto = { id: string; name: string; mime: string; bytes: number; width: number; height: number; sha256: string; createdAt: string };
const COLS = ['id', 'name', 'mime', 'bytes', 'width', 'height', 'sha256', 'createdAt'] as const;

export async function listUploads(db: Kysely<Database>, seriesId: string): Promise<UploadDto[]> {
  return db.selectFrom('uploads').select(COLS).where('seriesId', '=', seriesId).orderBy('createdAt', 'desc').execute();
}

export async function findUploadBySha(db: Kysely<Database>, seriesId: string, sha256: string): Promise<UploadDto | undefined> {
  return db.selectFrom('uploads').select(COLS).where('seriesId', '=', seriesId).where('sha256', '=', sha256).executeTakeFirst();
}

export async function uploadKeys(db: Kysely<Database>, id: string) {
  return db.selectFrom('uploads').select(['seriesId', 'originalKey', 'workingKey', 'previewKey', 'mime']).where('id', '=', id).executeTakeFirst();
}

export async function seriesOfUpload(db: Kysely<Database>, id: string): Promise<string | null> {
  return (await db.selectFrom('uploads').select('seriesId').where('id', '=', id).executeTakeFirst())?.seriesId ?? null;
}

export async function insertUpload(
  db: Kysely<Database>,
  u: Omit<Database['uploads'], 'id' | 'createdAt'>,
): Promise<UploadDto> {
  const id = randomUUID();
  await db.insertInto('uploads').values({ ...u, id, createdAt: new Date().toISOString() }).execute();
  return (await db.selectFrom('uploads').select(COLS).where('id', '=', id).executeTakeFirstOrThrow());
}

export async function deleteUpload(db: Kysely<Database>, id: string): Promise<void> {
  await db.deleteFrom('uploads').where('id', '=', id).execute();
}
