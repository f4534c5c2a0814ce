// The S3 fake (s3rver) on a free port with its own folder, for one test file.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from './free-port';
import { startFakeS3 } from '@/lib/storage/fake-s3';

export async function startS3Fake() {
  const port = await freePort();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-s3-'));
  delete process.env.S3_ENDPOINT;
  process.env.S3_FAKE_PORT = String(port);
  process.env.S3_FAKE_DIR = dir;
  return startFakeS3(port, dir);
}
