// Object storage through the S3 API. With S3_ENDPOINT/S3_BUCKET and credentials
// it talks to a real bucket; without, to the local s3rver fake on 127.0.0.1.
// Objects are never public: the app serves them after checking the role.
import 'server-only';
import { createReadStream, createWriteStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { stat } from 'node:fs/promises';
import { Readable } from 'node:stream';
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';

export const FAKE_S3_PORT_DEFAULT = 4569;

export function s3Config() {
  const fake = !process.env.S3_ENDPOINT;
  return {
    fake,
    endpoint: process.env.S3_ENDPOINT || `http://127.0.0.1:${process.env.S3_FAKE_PORT || FAKE_S3_PORT_DEFAULT}`,
    bucket: process.env.S3_BUCKET || 'quadrille',
    region: process.env.S3_REGION || 'us-east-1',
    accessKeyId: process.env.S3_ACCESS_KEY_ID || (fake ? 'S3RVER' : ''),
    secretAccessKey: process.env.S3_SECRET_ACCESS_KEY || (fake ? 'S3RVER' : ''),
  };
}

let client: { key: string; s3: S3Client } | undefined;
function s3() {
  const c = s3Config();
  const key = JSON.stringify(c);
  if (!client || client.key !== key) {
    client = {
      key,
      s3: new S3Client({
        endpoint: c.endpoint,
        region: c.region,
        forcePathStyle: true,
        // No checksum trailer unless an operation requires one: a streamed body then goes as it is, not in
        // aws-chunked framing, which S3-compatible stores (the s3rver fake among them) may keep as the content.
        requestChecksumCalculation: 'WHEN_REQUIRED',
        credentials: { accessKeyId: c.accessKeyId, secretAccessKey: c.secretAccessKey },
      }),
    };
  }
  return client.s3;
}

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: s3Config().bucket, Key: key, Body: body, ContentType: contentType }));
}

export async function getObject(key: string): Promise<{ body: Uint8Array; contentType: string } | null> {
  try {
    const r = await s3().send(new GetObjectCommand({ Bucket: s3Config().bucket, Key: key }));
    return { body: await r.Body!.transformToByteArray(), contentType: r.ContentType ?? 'application/octet-stream' };
  } catch (err) {
    if ((err as { name?: string }).name === 'NoSuchKey') return null;
    throw err;
  }
}

/** Puts a file from disk, streamed (a print file or a scan may be hundreds of MB). */
export async function putObjectFile(key: string, file: string, contentType: string): Promise<void> {
  const { size } = await stat(file);
  await s3().send(
    new PutObjectCommand({ Bucket: s3Config().bucket, Key: key, Body: createReadStream(file), ContentLength: size, ContentType: contentType }),
  );
}

/** An object as a stream with its length, never whole in memory; null when there is none. */
export async function getObjectStream(key: string): Promise<{ body: Readable; bytes: number; contentType: string } | null> {
  try {
    const r = await s3().send(new GetObjectCommand({ Bucket: s3Config().bucket, Key: key }));
    return { body: r.Body as Readable, bytes: Number(r.ContentLength ?? 0), contentType: r.ContentType ?? 'application/octet-stream' };
  } catch (err) {
    if ((err as { name?: string }).name === 'NoSuchKey') return null;
    throw err;
  }
}

/**
 * A stored object as the answer to a member's request, streamed (never whole in memory), with its length;
 * `filename` makes it a download. Not cached by the browser: a member removed from the series must not
 * keep reading it from there. Null when there is no such object.
 */
export async function objectResponse(key: string, opts: { contentType?: string; filename?: string } = {}): Promise<Response | null> {
  const obj = await getObjectStream(key);
  if (!obj) return null;
  return new Response(Readable.toWeb(obj.body) as ReadableStream, {
    headers: {
      'content-type': opts.contentType ?? obj.contentType,
      'content-length': String(obj.bytes),
      'cache-control': 'private, no-cache',
      ...(opts.filename ? { 'content-disposition': `attachment; filename="${opts.filename}"` } : {}),
    },
  });
}

/** Copies an object to a file on disk, streamed; false when there is no such object. */
export async function getObjectToFile(key: string, file: string): Promise<boolean> {
  const obj = await getObjectStream(key);
  if (!obj) return false;
  await pipeline(obj.body, createWriteStream(file));
  return true;
}

export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: s3Config().bucket, Key: key }));
}
