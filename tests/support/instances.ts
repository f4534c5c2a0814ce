// Several app instances as a deployment runs them: server processes (`server/main.mjs`) of one
// production build, sharing nothing but a PostgreSQL database and an S3 fake.
// Used by the multi-instance browser test and by the bench.
import { type ChildProcess, execFileSync, spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from './free-port';
import { createDatabase, type PgCluster, startPgCluster } from './pg-cluster';

export const ROOT = path.resolve(import.meta.dirname, '../..');
const NEXT_BIN = path.join(ROOT, 'node_modules/next/dist/bin/next');
/** The production server (`npm start`): Next.js's handler behind the front door's admission. */
export const SERVER_MAIN = path.join(ROOT, 'server/main.mjs');
const TSX_CLI = path.join(ROOT, 'node_modules/tsx/dist/cli.mjs');

export async function waitForHealth(url: string, server: ChildProcess, log: () => string, ms = 60_000) {
  const deadline = Date.now() + ms;
  while (Date.now() < deadline) {
    if (server.exitCode !== null || server.signalCode !== null) throw new Error(`the server exited early:\n${log()}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`the server did not answer within ${ms / 1000} s:\n${log()}`);
}

/** Builds the production app into `distDir` unless a build is there already. */
/** The newest change to anything the build is made of. */
function newestSource(): number {
  let newest = 0;
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else newest = Math.max(newest, fs.statSync(p).mtimeMs);
    }
  };
  for (const d of ['app', 'components', 'hooks', 'lib', 'db', 'public']) if (fs.existsSync(path.join(ROOT, d))) walk(path.join(ROOT, d));
  for (const f of ['next.config.mjs', 'proxy.ts', 'instrumentation.ts', 'package-lock.json']) {
    if (fs.existsSync(path.join(ROOT, f))) newest = Math.max(newest, fs.statSync(path.join(ROOT, f)).mtimeMs);
  }
  return newest;
}

/** Builds the app into `distDir` unless a build newer than every source file is there already. */
export function ensureBuild(distDir: string, opts: { force?: boolean } = {}) {
  const id = path.join(ROOT, distDir, 'BUILD_ID');
  if (!opts.force && fs.existsSync(id) && fs.statSync(id).mtimeMs > newestSource()) return;
  execFileSync(process.execPath, [NEXT_BIN, 'build'], {
    cwd: ROOT,
    env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1', NEXT_DIST_DIR: distDir, NODE_ENV: 'production' },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
}

export function seed(databaseUrl: string) {
  execFileSync(process.execPath, [TSX_CLI, 'db/cli.ts', 'seed'], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: databaseUrl, DEMO_SCAN: 'off' },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
}

export type Instance = { name: string; url: string; port: number; server: ChildProcess; log: () => string; kill: (signal?: NodeJS.Signals) => void };

export async function startInstance(opts: {
  name: string;
  distDir: string;
  databaseUrl: string;
  env?: Record<string, string>;
  /** The URL people reach this instance by (a load balancer's), if not its own. */
  publicUrl?: string;
  port?: number;
}): Promise<Instance> {
  const port = opts.port ?? (await freePort());
  const url = `http://127.0.0.1:${port}`;
  let output = '';
  const server = spawn(
    process.execPath,
    [
      ...(process.env.CPU_PROF_DIR ? ['--cpu-prof', `--cpu-prof-dir=${process.env.CPU_PROF_DIR}`] : []),
      SERVER_MAIN,
      '-H',
      '127.0.0.1',
      '-p',
      String(port),
    ],
    {
      cwd: ROOT,
      env: {
        ...process.env,
        NEXT_TELEMETRY_DISABLED: '1',
        NEXT_DIST_DIR: opts.distDir,
        NODE_ENV: 'production',
        DATABASE_URL: opts.databaseUrl,
        NEXTAUTH_URL: opts.publicUrl ?? url,
        NEXTAUTH_SECRET: 'multi-instance-test-secret-shared-by-all',
        MAIL_FAKE: 'off',
        ...opts.env,
      },
      detached: true, // its own process group: kill() stops next-server too
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  await waitForHealth(url, server, () => output);
  return {
    name: opts.name,
    url,
    port,
    server,
    log: () => output,
    kill: (signal = 'SIGTERM') => {
      try {
        if (server.pid) process.kill(-server.pid, signal);
      } catch {
        /* already gone */
      }
    },
  };
}

export type Deployment = {
  pg: PgCluster;
  databaseUrl: string;
  s3Port: number;
  instances: Instance[];
  stop: () => Promise<void>;
};

/**
 * A throwaway PostgreSQL with the demo data, an S3 fake, and `count` instances
 * of the build in `distDir`. `publicUrls[i]`, when given, is instance i's NEXTAUTH_URL.
 */
export async function startDeployment(opts: {
  distDir: string;
  count: number;
  env?: Record<string, string>;
  publicUrls?: string[];
  ports?: number[];
}): Promise<Deployment> {
  const pg = await startPgCluster();
  const databaseUrl = await createDatabase(pg.adminUrl, 'quadrille_multi');
  seed(databaseUrl);
  const s3Port = await freePort();
  const s3Dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-multi-s3-'));
  const { startFakeS3 } = await import('@/lib/storage/fake-s3');
  const s3 = await startFakeS3(s3Port, s3Dir, 'quadrille');
  const env = {
    S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
    S3_BUCKET: 'quadrille',
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    ...opts.env,
  };
  const instances: Instance[] = [];
  try {
    for (let i = 0; i < opts.count; i++) {
      instances.push(
        await startInstance({
          name: String.fromCharCode(65 + i),
          distDir: opts.distDir,
          databaseUrl,
          env,
          publicUrl: opts.publicUrls?.[i],
          port: opts.ports?.[i],
        }),
      );
    }
  } catch (err) {
    for (const inst of instances) inst.kill('SIGKILL');
    await s3.close();
    pg.stop();
    throw err;
  }
  return {
    pg,
    databaseUrl,
    s3Port,
    instances,
    stop: async () => {
      for (const inst of instances) inst.kill('SIGKILL');
      await s3.close();
      pg.stop();
      fs.rmSync(s3Dir, { recursive: true, force: true });
    },
  };
}
