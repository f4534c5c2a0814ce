// Keeps a prepared upload: its three variants in object storage, one row in the
// database. The same file again in the same series is stored once.
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { isUniqueViolation } from '@/db/dialect';
import { type UploadDto, findUploadBySha, insertUpload } from '@/db/queries/uploads';
import { putObject } from '@/lib/storage/s3';
import { ACCEPTED, type Prepared } from './process';

export async function storeUpload(
  db: Kysely<Database>,
  input: { seriesId: string; userId: string; name: string; prepared: Prepared },
): Promise<{ upload: UploadDto; duplicate: boolean }> {
  const { seriesId, prepared } = input;
  const existing = await findUploadBySha(db, seriesId, prepared.sha256);
  if (existing) return { upload: existing, duplicate: true };
  const ext = ACCEPTED[prepared.mime];
  const prefix = `series/${seriesId}/uploads/${prepared.sha256}`;
  const keys = { originalKey: `${prefix}/original.${ext}`, workingKey: `${prefix}/working.${ext}`, previewKey: `${prefix}/preview.webp` };
  await putObject(keys.originalKey, prepared.original, prepared.mime);
  await putObject(keys.workingKey, prepared.working, prepared.mime);
  await putObject(keys.previewKey, prepared.preview, 'image/webp');
  let upload: UploadDto;
  try {
    upload = await insertUpload(db, {
      seriesId,
      sha256: prepared.sha256,
      name: input.name.slice(0, 200),
      mime: prepared.mime,
      bytes: prepared.bytes,
      width: prepared.width,
      height: prepared.height,
      ...keys,
      createdBy: input.userId,
    });
  } catch (err) {
    // The same file sent twice at once: the other request stored it first (same keys, same bytes).
    if (!isUniqueViolation(err)) throw err;
    const stored = await findUploadBySha(db, seriesId, prepared.sha256);
    if (!stored) throw err;
    return { upload: stored, duplicate: true };
  }
  return { upload, duplicate: false };
}
