// The S3 fake (s3rver) on a free port with its own folder, for one test file.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from './free-port';
import { afterAll, beforeAll } from 'vitest';
import { startFakeS3 } from '@/lib/storage/fake-s3';
import { freshDb } from './test-db';

export async function startS3Fake() {
  const port = await freePort();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-s3-'));
  delete process.env.S3_ENDPOINT;
  process.env.S3_FAKE_PORT = String(port);
  process.env.S3_FAKE_DIR = dir;
  return startFakeS3(port, dir);
}

/** For a test file: the S3 fake and a fresh seeded database, opened before its tests and closed after. */
export function useS3AndDb(): { db: () => Awaited<ReturnType<typeof freshDb>> } {
  let db: Awaited<ReturnType<typeof freshDb>> | undefined;
  let s3: Awaited<ReturnType<typeof startS3Fake>> | undefined;
  beforeAll(async () => {
    s3 = await startS3Fake();
    db = await freshDb();
  });
  afterAll(async () => {
    await s3?.close();
  });
  return { db: () => db! };
}
