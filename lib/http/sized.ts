// A JSON answer with its Content-Length. Next.js compresses every answer it streams
// without one, however small, on the request thread — in a burst of small answers
// (sign-ins refused 429, health checks) that gzip work was most of the server's time.
// With the length known, answers under 1 KB go as they are (the compression
// middleware's threshold) and larger JSON is still compressed.

/** The same answer with Content-Length, when it is JSON without one; anything else as it is. */
export async function sized(res: Response): Promise<Response> {
  const type = res.headers.get('content-type') ?? '';
  if (!res.body || res.headers.has('content-length') || !type.startsWith('application/json')) return res;
  const body = await res.arrayBuffer();
  const headers = new Headers(res.headers);
  headers.set('content-length', String(body.byteLength));
  return new Response(body, { status: res.status, statusText: res.statusText, headers });
}
