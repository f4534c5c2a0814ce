// Receives, checks and keeps a final page for a gag or a matter page: the file
// streams to disk (busboy), sharp checks and prepares it, its files go to object
// storage (keyed by content, so the same scan is stored once), then one row.
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { type FinalOwner, type FinalPageDto, addFinalPage } from '@/db/queries/final-pages';
import { defaultFit } from '@/lib/print/final-fit';
import type { PageSpec } from '@/lib/print/geometry';
import { putObject, putObjectFile } from '@/lib/storage/s3';
import { FINAL_MAX_BYTES, prepareFinalPage } from './final-page';
import { receiveFile } from './receive';

export async function uploadFinalPage(
  req: Request,
  db: Kysely<Database>,
  input: { seriesId: string; userId: string; owner: FinalOwner; spec: PageSpec },
): Promise<{ page: FinalPageDto; duplicate: boolean }> {
  const file = await receiveFile(req, { field: 'file', maxBytes: FINAL_MAX_BYTES });
  try {
    const p = await prepareFinalPage(file.path);
    try {
      const prefix = `series/${input.seriesId}/final-pages/${p.sha256}`;
      const keys = {
        keptKey: `${prefix}/kept.${p.kept.ext}`,
        displayKey: `${prefix}/display.${p.display.ext}`,
        previewKey: `${prefix}/preview.webp`,
      };
      await putObjectFile(keys.keptKey, p.kept.path, p.kept.mime);
      await putObject(keys.displayKey, p.display.data, p.display.mime);
      await putObject(keys.previewKey, p.preview, 'image/webp');
      return await addFinalPage(db, input.owner, {
        seriesId: input.seriesId,
        sha256: p.sha256,
        name: file.name.slice(0, 200),
        mime: p.mime,
        bytes: p.bytes,
        width: p.width,
        height: p.height,
        bitsPerPixel: p.bitsPerPixel,
        colour: p.colour,
        ppi: p.ppi,
        keptMime: p.kept.mime,
        ...keys,
        fit: defaultFit(input.spec, p),
        createdBy: input.userId,
      });
    } finally {
      await p.discard();
    }
  } finally {
    await file.discard();
  }
}
