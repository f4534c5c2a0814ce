// @ts-check
// The production server: Next.js's own request handler (the same one `next start` runs) behind a front
// door that lets password forms into Next.js a few at a time (server/admission.mjs).
//   node server/main.mjs [--hostname 127.0.0.1] [--port 3000]   (PORT and HOSTNAME work too)
import http from 'node:http';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { admission, clientOf, isCredentialForm } from './admission.mjs';

const { values } = parseArgs({
  options: { hostname: { type: 'string', short: 'H' }, port: { type: 'string', short: 'p' } },
});
const hostname = values.hostname ?? process.env.HOSTNAME ?? '0.0.0.0';
const port = Number(values.port ?? process.env.PORT ?? 3000);
const dir = path.resolve(import.meta.dirname, '..');

// As `next start` does: a production server whatever the shell said.
process.env.NODE_ENV = 'production';
const { default: next } = await import('next');
const app = next({ dev: false, dir, hostname, port });
await app.prepare();
const handle = app.getRequestHandler();
const upgrade = app.getUpgradeHandler();

// As lib/auth/client-address.ts reads TRUST_PROXY: how many proxies in front append to X-Forwarded-For.
const trustedHops = /^\d+$/.test(process.env.TRUST_PROXY ?? '') ? Number(process.env.TRUST_PROXY) : process.env.TRUST_PROXY === 'true' ? 1 : 0;
// A few at a time: a sign-in spends most of its time waiting for the hashing worker, not the event loop.
const passwords = admission({
  concurrent: 4,
  waiting: 1024,
  perClient: 256,
  what: 'sign-ins',
  keyOf: (req) => clientOf(req, trustedHops),
});

const server = http.createServer((req, res) => {
  if (isCredentialForm(req)) passwords.admit(req, res, handle);
  else void handle(req, res);
});
server.on('upgrade', (req, socket, head) => void upgrade(req, socket, head));
server.listen(port, hostname, () => {
  console.log(`▲ Quadrille ready on http://${hostname}:${port}`);
});

const stop = () => {
  server.close();
  void app.close().finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 3000).unref();
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
