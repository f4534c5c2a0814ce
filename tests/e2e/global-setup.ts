// Builds the production app into .next-test, seeds a temporary SQLite database,
// and serves it with `server/main.mjs` (as `npm start` does) on 127.0.0.1 for the browser tests.
import { execFileSync, spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { freePort } from '../support/free-port';
import { waitForHealth } from '../support/instances';

const root = path.resolve(import.meta.dirname, '../..');
const DIST = '.next-test';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const env = { ...process.env, NEXT_TELEMETRY_DISABLED: '1', NEXT_DIST_DIR: DIST };
  const reuse = process.env.E2E_REUSE_BUILD === '1' && fs.existsSync(path.join(root, DIST, 'BUILD_ID'));
  if (!reuse) {
    console.log('[e2e] next build (production) …');
    execFileSync(process.execPath, [path.join(root, 'node_modules/next/dist/bin/next'), 'build'], {
      cwd: root,
      env: { ...env, NODE_ENV: 'production' },
      stdio: ['ignore', 'inherit', 'inherit'],
    });
  }

  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-e2e-'));
  const databaseUrl = `file:${path.join(dataDir, 'e2e.sqlite')}`;
  execFileSync(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), 'db/cli.ts', 'seed'], {
    cwd: root,
    // The test server brings its own storage: no demo scan in someone else's.
    env: { ...env, DATABASE_URL: databaseUrl, DEMO_SCAN: 'off' },
    stdio: ['ignore', 'inherit', 'inherit'],
  });

  const port = await freePort();
  const mailPort = await freePort();
  const s3Port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  let output = '';
  const server = spawn(process.execPath, [path.join(root, 'server/main.mjs'), '-H', '127.0.0.1', '-p', String(port)], {
    cwd: root,
    env: {
      ...env,
      NODE_ENV: 'production',
      DATABASE_URL: databaseUrl,
      NEXTAUTH_URL: baseUrl,
      NEXTAUTH_SECRET: 'e2e-secret-for-the-test-server-only',
      // The local SMTP fake starts with the server; /dev/mail shows what it caught.
      MAIL_FAKE_PORT: String(mailPort),
      MAIL_FAKE_DIR: path.join(dataDir, 'mail'),
      QUADRILLE_DEV_PAGES: '1',
      // The local S3 fake starts with the server too.
      S3_FAKE_PORT: String(s3Port),
      S3_FAKE_DIR: path.join(dataDir, 's3'),
    },
    detached: true, // its own process group, so teardown stops next-server too
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  await waitForHealth(baseUrl, server, () => output);
  console.log(`[e2e] app at ${baseUrl}, database ${databaseUrl}`);
  project.provide('baseUrl', baseUrl);

  return async () => {
    try {
      if (server.pid) process.kill(-server.pid, 'SIGTERM');
    } catch {
      /* already gone */
    }
    fs.rmSync(dataDir, { recursive: true, force: true });
    if (process.env.E2E_SHOW_SERVER_LOG === '1') console.log(output);
  };
}
