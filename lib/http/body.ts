// Reading a request body with a ceiling. The body is read chunk by chunk as it
// arrives and dropped the moment it passes the route's limit, whether or not
// the client declared a Content-Length, so an oversized body costs neither the
// time to receive it nor the memory to hold it.
import { Refused } from '@/lib/refused';

export function tooLarge(maxBytes: number, what = 'The body'): Refused {
  return new Refused(413, `${what} is over ${maxBytes.toLocaleString('en')} bytes; send it in smaller parts.`);
}

/** Refuses at once a body whose declared length is over the limit (the body is not read). */
export async function refuseDeclaredOver(req: Request, maxBytes: number, what?: string): Promise<void> {
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > maxBytes) {
    await req.body?.cancel().catch(() => undefined);
    throw tooLarge(maxBytes, what);
  }
}

/** The whole body as bytes, at most `maxBytes`; 413 as soon as more arrives. */
export async function readBodyCapped(req: Request, maxBytes: number, what?: string): Promise<Buffer> {
  await refuseDeclaredOver(req, maxBytes, what);
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(maxBytes, what);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, total);
}

/** The body as UTF-8 text, at most `maxBytes`. */
export async function readTextCapped(req: Request, maxBytes: number, what?: string): Promise<string> {
  return (await readBodyCapped(req, maxBytes, what)).toString('utf8');
}
