// The local S3-compatible fake (s3rver) on 127.0.0.1, keeping objects in a
// folder (S3_FAKE_DIR, default data/s3). Started with the app and by the tests.
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

/** Resolves when the port can be bound on 127.0.0.1; rejects with EADDRINUSE otherwise. */
function portFree(port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once('error', reject);
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve()));
  });
}

export async function startFakeS3(
  port: number,
  dir = path.resolve(/*turbopackIgnore: true*/ process.env.S3_FAKE_DIR || 'data/s3'),
  bucket = process.env.S3_BUCKET || 'quadrille',
) {
  // s3rver never settles its promise when the port is taken: check first.
  await portFree(port);
  fs.mkdirSync(/*turbopackIgnore: true*/ dir, { recursive: true });
  const { default: S3rver } = await import('s3rver');
  const server = new S3rver({ address: '127.0.0.1', port, directory: dir, silent: true, configureBuckets: [{ name: bucket, configs: [] }] });
  await server.run();
  return { close: () => server.close() };
}
