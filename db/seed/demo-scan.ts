// One pencil scan in the demo, placed as a lightbox under a pass, so the
// lightbox can be seen without uploading first. It needs object storage, which
// the app's local fake provides: the seed starts that fake for the moment it
// needs it (or uses the one a running app holds, or S3_ENDPOINT). Invented art.
import type { Kysely } from 'kysely';
import sharp from 'sharp';
import type { Database } from '@/db/database';
import { findPass } from '@/db/queries/passes';
import { applyBatch } from '@/db/queries/batches';
import { pageSpecOf } from '@/db/queries/series';
import { DEMO_SERIES_ID } from './demo-data';

export const DEMO_SCAN_PASS = 'demo-gag-09-pass-1';
const PX = 1771; // 150 mm at 300 ppi

/** A rough pencil drawing on paper: the pier, a plank with barnacle cups, the teapot. */
async function pencilScan(): Promise<Buffer> {
  const s = PX / 150; // px per mm
  const line = (x0: number, y0: number, x1: number, y1: number, w = 0.5) =>
    `<line x1="${x0 * s}" y1="${y0 * s}" x2="${x1 * s}" y2="${y1 * s}" stroke="#4b4b4b" stroke-width="${w * s}" stroke-linecap="round" opacity="0.8"/>`;
  const ellipse = (cx: number, cy: number, rx: number, ry: number) =>
    `<ellipse cx="${cx * s}" cy="${cy * s}" rx="${rx * s}" ry="${ry * s}" fill="none" stroke="#4b4b4b" stroke-width="${0.45 * s}" opacity="0.75"/>`;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${PX}" height="${PX}">
    <rect width="100%" height="100%" fill="#f4f1ea"/>
    ${line(8, 112, 142, 110, 0.6)}${line(8, 114, 142, 113, 0.3)}
    ${[20, 45, 70, 95, 120].map((x) => line(x, 113, x - 2, 130, 0.4)).join('')}
    ${line(60, 100, 130, 100, 0.5)}${[75, 95, 115].map((x) => ellipse(x, 97, 4, 3)).join('')}
    ${ellipse(38, 92, 16, 12)}${line(52, 88, 64, 78, 0.5)}${ellipse(22, 92, 5, 7)}${ellipse(38, 79, 7, 2.5)}
    ${line(30, 60, 36, 52, 0.3)}${line(36, 52, 44, 60, 0.3)}${line(110, 40, 118, 34, 0.3)}${line(118, 34, 126, 40, 0.3)}
  </svg>`;
  return sharp(Buffer.from(svg)).greyscale().png().toBuffer();
}

/** Places the scan once; says what it did. Never fails the seed: without storage, the demo simply has no scan. */
export async function seedDemoScan(db: Kysely<Database>): Promise<string> {
  const pass = await findPass(db, DEMO_SCAN_PASS);
  if (!pass) return 'no demo pass to place a scan on';
  const placed = await db.selectFrom('lightboxes').select('rowId').where('passId', '=', pass.id).executeTakeFirst();
  if (placed) return 'demo scan already placed';
  let stopFake: (() => Promise<void>) | null = null;
  try {
    if (!process.env.S3_ENDPOINT) {
      const { startFakeS3 } = await import('@/lib/storage/fake-s3');
      const { FAKE_S3_PORT_DEFAULT } = await import('@/lib/storage/s3');
      try {
        const fake = await startFakeS3(Number(process.env.S3_FAKE_PORT || FAKE_S3_PORT_DEFAULT));
        stopFake = fake.close;
      } catch (err) {
        // A running app already holds the fake on that port: store through it.
        if ((err as { code?: string }).code !== 'EADDRINUSE') throw err;
      }
    }
    const { prepareUpload } = await import('@/lib/uploads/process');
    const { storeUpload } = await import('@/lib/uploads/store');
    const prepared = await prepareUpload(await pencilScan());
    const { upload } = await storeUpload(db, { seriesId: DEMO_SERIES_ID, userId: 'demo-user-owner', name: 'tea-party-pencils.png', prepared });
    const spec = await pageSpecOf(db, DEMO_SERIES_ID);
    const bleed = spec.bleed;
    await applyBatch(db, {
      passId: pass.id,
      batchId: 'demo-scan',
      userId: 'demo-user-owner',
      spec,
      ops: [
        {
          op: 'lightbox',
          lightbox: {
            id: 'demo-scan',
            uploadId: upload.id,
            panel: null,
            x: -bleed,
            y: -bleed,
            w: spec.trimW + 2 * bleed,
            h: spec.trimH + 2 * bleed,
            rotation: 0,
            opacity: 0.35,
            visible: true,
          },
        },
      ],
    });
    return 'demo scan placed under "Tea Party", pass 1';
  } catch (err) {
    return `demo scan skipped (${(err as Error).message})`;
  } finally {
    await stopFake?.();
  }
}
