// The S3 fake (s3rver) on a free port with its own folder, for one test file.
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { startFakeS3 } from '@/lib/storage/fake-s3';

export async function startS3Fake() {
  const port = await new Promise<number>((resolve) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const p = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(p));
    });
  });
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-s3-'));
  delete process.env.S3_ENDPOINT;
  process.env.S3_FAKE_PORT = String(port);
  process.env.S3_FAKE_DIR = dir;
  return startFakeS3(port, dir);
}
