// The smallest load balancer the multi-instance tests need: forwards each
// request to the first instance that accepts a connection, in order, and
// streams the answer back (event streams included). When an instance dies,
// its open responses end and the next requests go to the next one.
import http from 'node:http';
import { freePort } from './free-port';

export async function startFailoverProxy(targets: () => string[], port?: number): Promise<{ url: string; close: () => Promise<void> }> {
  port ??= await freePort();
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const body = Buffer.concat(chunks);
      const tryTarget = (i: number) => {
        const list = targets();
        if (i >= list.length) {
          res.writeHead(502, { 'content-type': 'text/plain' }).end('No instance answered.');
          return;
        }
        const target = new URL(list[i]!);
        const up = http.request(
          {
            host: target.hostname,
            port: target.port,
            method: req.method,
            path: req.url,
            // The Host the browser asked for goes through, as a load balancer passes it.
            headers: req.headers,
          },
          (upRes) => {
            res.writeHead(upRes.statusCode ?? 502, upRes.headers);
            upRes.pipe(res);
            upRes.on('error', () => res.destroy());
            upRes.on('aborted', () => res.destroy());
          },
        );
        let answered = false;
        up.on('response', () => (answered = true));
        up.on('error', () => {
          if (!answered && !res.headersSent) tryTarget(i + 1);
          else res.destroy();
        });
        res.on('close', () => up.destroy());
        up.end(body);
      };
      tryTarget(0);
    });
  });
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  return {
    url: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
