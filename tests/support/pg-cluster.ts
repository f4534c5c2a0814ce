// A throwaway PostgreSQL cluster from the machine's own PostgreSQL binaries
// (Debian's `postgresql` package): initdb into a temp folder, a free port on
// 127.0.0.1, trust auth, stopped and deleted by stop(). initdb refuses to run
// as root, so as root the cluster belongs to the `postgres` user.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { freePort } from './free-port';

export const PG_INSTALL_HINT =
  'The tests run on PostgreSQL as well as SQLite and could not start a throwaway cluster. Install PostgreSQL with ' +
  '`sudo apt-get install -y postgresql` (tests/ensure-tools.sh does it when run as root), or set PG_BIN to the folder holding initdb and pg_ctl.';

export function findPgBin(): string {
  const candidates = process.env.PG_BIN
    ? [process.env.PG_BIN]
    : fs.existsSync('/usr/lib/postgresql')
      ? fs
          .readdirSync('/usr/lib/postgresql')
          .sort((a, b) => Number(b) - Number(a))
          .map((v) => `/usr/lib/postgresql/${v}/bin`)
      : [];
  const bin = candidates.find((d) => fs.existsSync(path.join(d, 'initdb')) && fs.existsSync(path.join(d, 'pg_ctl')));
  if (!bin) throw new Error(`No initdb/pg_ctl found (looked in ${candidates.join(', ') || '/usr/lib/postgresql/*/bin'}). ${PG_INSTALL_HINT}`);
  return bin;
}

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

function run(cmd: string, args: string[]) {
  if (isRoot()) {
    const line = [cmd, ...args].map((a) => `'${a.replace(/'/g, `'\\''`)}'`).join(' ');
    return execFileSync('su', ['postgres', '-s', '/bin/sh', '-c', line], { stdio: ['ignore', 'pipe', 'pipe'] });
  }
  return execFileSync(cmd, args, { stdio: ['ignore', 'pipe', 'pipe'] });
}

export type PgCluster = { adminUrl: string; port: number; stop: () => void };

export async function startPgCluster(): Promise<PgCluster> {
  const bin = findPgBin();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-pg-'));
  fs.chmodSync(dir, 0o777);
  if (isRoot()) execFileSync('chown', ['postgres', dir]);
  const data = path.join(dir, 'data');
  const port = await freePort();
  try {
    run(path.join(bin, 'initdb'), ['-D', data, '--auth=trust', '-U', 'postgres', '-E', 'UTF8', '--no-sync']);
    // fsync off: a throwaway cluster for tests; durability is not under test here.
    const opts = `-c listen_addresses=127.0.0.1 -p ${port} -k ${dir} -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=300`;
    run(path.join(bin, 'pg_ctl'), ['-D', data, '-o', opts, '-l', path.join(dir, 'server.log'), '-w', '-t', '60', 'start']);
  } catch (err) {
    const stderr = (err as { stderr?: Buffer }).stderr?.toString() ?? '';
    const log = fs.existsSync(path.join(dir, 'server.log')) ? fs.readFileSync(path.join(dir, 'server.log'), 'utf8') : '';
    throw new Error(`PostgreSQL did not start: ${String(err)}\n${stderr}\n${log}\n${PG_INSTALL_HINT}`);
  }
  const adminUrl = `postgres://postgres@127.0.0.1:${port}/postgres`;
  return {
    adminUrl,
    port,
    stop: () => {
      try {
        run(path.join(bin, 'pg_ctl'), ['-D', data, '-m', 'immediate', '-w', 'stop']);
      } catch {
        /* already gone */
      }
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A new, empty database on the cluster; returns its URL. */
export async function createDatabase(adminUrl: string, prefix = 'quadrille_test'): Promise<string> {
  const name = `${prefix}_${Math.random().toString(36).slice(2, 10)}`;
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`create database "${name}"`);
  } finally {
    await client.end();
  }
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return url.toString();
}
