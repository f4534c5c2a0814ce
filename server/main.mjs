// @ts-check
// The production server: Next.js's own request handler (the one `next start` runs) behind a front door that
// lets password forms into Next.js a few at a time (server/admission.mjs).
//   node server/main.mjs [--hostname 127.0.0.1] [--port 3000] [--keepAliveTimeout ms]   (PORT works too)
// Without --hostname it listens on every address, IPv4 and IPv6, as `next start` does.
import http from 'node:http';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { trustedProxyHops } from '../lib/auth/client-key.mjs';
import { admission, clientOf, isCredentialForm } from './admission.mjs';

const { values } = parseArgs({
  options: {
    hostname: { type: 'string', short: 'H' },
    port: { type: 'string', short: 'p' },
    keepAliveTimeout: { type: 'string' },
  },
});
const hostname = values.hostname;
const port = Number(values.port ?? process.env.PORT ?? 3000);
const dir = path.resolve(import.meta.dirname, '..');
// Relative paths (the default SQLite file under data/, the worker scripts) are the app's own.
process.chdir(dir);

// A production server whatever the shell said (`next start` would keep a NODE_ENV already set; this server
// only ever serves a production build).
process.env.NODE_ENV = 'production';
const { default: next } = await import('next');
const app = next({ dev: false, dir, hostname, port });
await app.prepare();
const handle = app.getRequestHandler();

const hops = trustedProxyHops(process.env);
// A few at a time: a sign-in spends most of its time waiting for the hashing worker, not the event loop.
const passwords = admission({
  concurrent: 4,
  waiting: 1024,
  perClient: 256,
  what: 'sign-ins',
  keyOf: (req) => clientOf(req, hops),
});

/** @param {import('node:http').ServerResponse} res */
const failed = (res) => (/** @type {unknown} */ err) => {
  console.error('[server] request failed:', err);
  if (!res.headersSent) {
    res.statusCode = 500;
    res.end('Internal Server Error');
  } else res.destroy();
};

const server = http.createServer((req, res) => {
  if (isCredentialForm(req)) passwords.admit(req, res, handle);
  else handle(req, res).catch(failed(res));
});
if (values.keepAliveTimeout) server.keepAliveTimeout = Number(values.keepAliveTimeout);
server.on('error', (err) => {
  console.error('[server] could not listen:', err);
  process.exit(1);
});
server.listen(port, hostname, () => {
  console.log(`▲ Quadrille ready on http://${hostname ?? 'localhost'}:${port}`);
});

// As `next start`: stop taking connections, let the answers under way finish, then close Next.js and exit.
// Connections still open after the grace period are closed.
/** @param {number} code */
const stop = (code) => {
  server.closeIdleConnections();
  setTimeout(
    () => {
      server.closeAllConnections();
      process.exit(code);
    },
    Number(process.env.SHUTDOWN_GRACE_MS || 10_000),
  ).unref();
  server.close(() => {
    void app.close().finally(() => process.exit(code));
  });
};
if (!process.env.NEXT_MANUAL_SIG_HANDLE) {
  process.once('SIGTERM', () => stop(143));
  process.once('SIGINT', () => stop(130));
}
