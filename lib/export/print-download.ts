// A built print or cover file as a download, streamed from object storage (never whole in memory).
import 'server-only';
import { Readable } from 'node:stream';
import { getObjectStream } from '@/lib/storage/s3';

export async function pdfFileResponse(key: string, title: string, kind: 'print' | 'cover', proof: boolean): Promise<Response | null> {
  const obj = await getObjectStream(key);
  if (!obj) return null;
  const name = `${title.replace(/[^A-Za-z0-9 _-]/g, '')}-${kind}${proof ? '-proof' : ''}.pdf`;
  return new Response(Readable.toWeb(obj.body) as ReadableStream, {
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(obj.bytes),
      'cache-control': 'private, no-cache',
      'content-disposition': `attachment; filename="${name}"`,
    },
  });
}
