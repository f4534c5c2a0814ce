// A built print or cover file as a download, streamed from object storage (never whole in memory).
import 'server-only';
import { objectResponse } from '@/lib/storage/s3';

export async function pdfFileResponse(key: string, title: string, kind: 'print' | 'cover', proof: boolean): Promise<Response | null> {
  const name = `${title.replace(/[^A-Za-z0-9 _-]/g, '')}-${kind}${proof ? '-proof' : ''}.pdf`;
  return objectResponse(key, { contentType: 'application/pdf', filename: name });
}
