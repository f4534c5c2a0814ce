// Receives one uploaded file from a multipart/form-data body as it streams in:
// the file part goes straight to a temporary file (never held whole in memory),
// and the request is cut off with 413 the moment the file passes its limit,
// whatever Content-Length said (or did not say).
import 'server-only';
import { randomUUID } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { ReadableStream as NodeWebStream } from 'node:stream/web';
import busboy from 'busboy';
import { Refused } from '@/lib/refused';

export type Received = { path: string; name: string; bytes: number; discard: () => Promise<void> };

/** Room for the multipart framing around the file (boundaries, part headers, a few small fields). */
const FRAMING_BYTES = 64 * 1024;

function mb(bytes: number): string {
  return `${Math.round(bytes / 1048576)} MB`;
}

export async function receiveFile(req: Request, opts: { field: string; maxBytes: number }): Promise<Received> {
  const type = req.headers.get('content-type') ?? '';
  const wrongShape = `Send the image as multipart/form-data in a field named "${opts.field}".`;
  if (!/^multipart\/form-data\b/i.test(type) || !req.body) {
    await req.body?.cancel().catch(() => undefined);
    throw new Refused(422, wrongShape);
  }
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > opts.maxBytes + FRAMING_BYTES) {
    await req.body.cancel().catch(() => undefined);
    throw new Refused(413, `The file is over ${mb(opts.maxBytes)}.`);
  }

  const dir = path.join(tmpdir(), 'quadrille-uploads');
  await mkdir(dir, { recursive: true });
  const file = path.join(dir, randomUUID());
  const discard = () => rm(file, { force: true });

  let parser: busboy.Busboy;
  try {
    parser = busboy({
      headers: { 'content-type': type },
      limits: { fileSize: opts.maxBytes, files: 1, fields: 16, fieldSize: 4096, parts: 20, headerPairs: 50 },
    });
  } catch {
    await req.body.cancel().catch(() => undefined);
    throw new Refused(422, wrongShape);
  }
  const source = Readable.fromWeb(req.body as unknown as NodeWebStream<Uint8Array>);

  const received = new Promise<{ name: string; bytes: number }>((resolve, reject) => {
    let found: Promise<{ name: string; bytes: number }> | null = null;
    parser.on('file', (field, stream, info) => {
      if (field !== opts.field || found) {
        stream.resume();
        return;
      }
      let bytes = 0;
      stream.on('data', (chunk: Buffer) => (bytes += chunk.length));
      stream.on('limit', () => {
        const err = new Refused(413, `The file is over ${mb(opts.maxBytes)}.`);
        stream.destroy(err);
        source.destroy();
        reject(err);
      });
      found = pipeline(stream, createWriteStream(file)).then(() => ({ name: info.filename || 'upload', bytes }));
      found.catch(reject);
    });
    parser.on('filesLimit', () => undefined);
    parser.on('error', () => reject(new Refused(422, wrongShape)));
    parser.on('close', () => {
      if (!found) reject(new Refused(422, `Send the image in a field named "${opts.field}".`));
      else found.then(resolve, reject);
    });
  });
  source.on('error', () => undefined);
  source.pipe(parser);
  try {
    const { name, bytes } = await received;
    return { path: file, name, bytes, discard };
  } catch (err) {
    source.destroy();
    await discard();
    throw err instanceof Refused ? err : new Refused(422, wrongShape);
  }
}
