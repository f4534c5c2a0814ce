// The local S3-compatible fake (s3rver) on 127.0.0.1, keeping objects in a
// folder (S3_FAKE_DIR, default data/s3). Started with the app and by the tests.
import fs from 'node:fs';
import path from 'node:path';

export async function startFakeS3(port: number, dir = path.resolve(/*turbopackIgnore: true*/ process.env.S3_FAKE_DIR || 'data/s3'), bucket = process.env.S3_BUCKET || 'quadrille') {
  fs.mkdirSync(/*turbopackIgnore: true*/ dir, { recursive: true });
  const { default: S3rver } = await import('s3rver');
  const server = new S3rver({ address: '127.0.0.1', port, directory: dir, silent: true, configureBuckets: [{ name: bucket, configs: [] }] });
  await server.run();
  return { close: () => server.close() };
}
