// One pool of worker threads per process (piscina) for the CPU-heavy work in
// lib/workers/heavy-worker.ts, so a 50,000-stroke thumbnail or a 120-page PDF
// never holds up the requests behind it. Results that depend only on a pass's
// seq are kept (see `remembered`), so the same picture is computed once.
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { SHARE_ENV } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { Refused } from '@/lib/refused';
import type * as Heavy from './heavy-worker';

type Tasks = Omit<typeof Heavy, 'default' | 'ready'>;
type TaskName = keyof Tasks;

/** Jobs waiting beyond this many are refused with 503 rather than queued without end. */
export const MAX_QUEUED_JOBS = 64;

function threads(): number {
  const set = Number(process.env.HEAVY_WORKERS);
  return Number.isInteger(set) && set > 0 ? set : Math.max(1, Math.min(4, availableParallelism()));
}

const holder = globalThis as unknown as { __quadrilleHeavyPool?: Piscina };

function pool(): Piscina {
  holder.__quadrilleHeavyPool ??= new Piscina({
    // The worker is TypeScript, loaded through tsx (a runtime dependency, as for the migrations);
    // react-server makes 'server-only' imports resolve as they do in the app's server build.
    filename: path.join(process.cwd(), 'lib/workers/heavy-worker.mjs'),
    execArgv: ['--conditions=react-server'],
    env: SHARE_ENV,
    minThreads: 0,
    maxThreads: threads(),
    idleTimeout: 60_000,
    maxQueue: MAX_QUEUED_JOBS,
  });
  return holder.__quadrilleHeavyPool;
}

/** Starts the pool with one thread loaded (at server start). */
export function warmHeavyPool(): void {
  pool()
    .run({}, { name: 'ready' })
    .catch(() => undefined);
}

/** Runs one task in a worker thread; 503 with Retry-After when too many wait already. */
export function runHeavy<N extends TaskName>(name: N, args: Parameters<Tasks[N]>[0]): Promise<Awaited<ReturnType<Tasks[N]>>> {
  return runHeavyTransferring(name, args, []);
}

/** As runHeavy, handing over objects (a MessagePort) that move to the worker rather than being copied. */
export async function runHeavyTransferring<N extends TaskName>(
  name: N,
  args: Parameters<Tasks[N]>[0],
  transferList: Transferable[],
): Promise<Awaited<ReturnType<Tasks[N]>>> {
  try {
    return await pool().run(args, { name, transferList: transferList as never });
  } catch (err) {
    if (err instanceof Error && /queue is at limit/i.test(err.message)) {
      throw new Refused(503, 'The server is busy with other large jobs; try again in a few seconds.', undefined, { 'Retry-After': '5' });
    }
    throw err;
  }
}

/** For tests and shutdown. */
export async function closeHeavyPool(): Promise<void> {
  const p = holder.__quadrilleHeavyPool;
  const h = hashHolder.__quadrilleHashPool;
  holder.__quadrilleHeavyPool = undefined;
  hashHolder.__quadrilleHashPool = undefined;
  await Promise.all([p?.close({ force: true }), h?.close({ force: true })]);
}

// Password hashing has a pool of its own, apart from the large jobs: a sign-in never waits behind a
// PDF, is never refused for a full queue (the sign-in limits bound how many arrive), and a burst of
// them takes at most these threads.
const hashHolder = globalThis as unknown as { __quadrilleHashPool?: Piscina };

function hashThreads(): number {
  const set = Number(process.env.HASH_WORKERS);
  return Number.isInteger(set) && set > 0 ? set : Math.max(1, Math.min(4, Math.floor(availableParallelism() / 2)));
}

function hashPool(): Piscina {
  hashHolder.__quadrilleHashPool ??= new Piscina({
    filename: path.join(process.cwd(), 'lib/workers/hash-worker.mjs'),
    minThreads: 0,
    maxThreads: hashThreads(),
    idleTimeout: 30_000,
  });
  return hashHolder.__quadrilleHashPool;
}

export type ScryptJob = { plain: string; salt: Uint8Array; N: number; r: number; p: number; maxmem: number; length: number };

/** scrypt in the hashing pool. */
export async function scryptInPool(job: ScryptJob): Promise<Buffer> {
  return Buffer.from((await hashPool().run(job, { name: 'scryptKey' })) as Uint8Array);
}

/** A bcrypt hash (from before scrypt) checked in the hashing pool. */
export async function bcryptInPool(plain: string, hash: string): Promise<boolean> {
  return (await hashPool().run({ plain, hash }, { name: 'bcryptCompare' })) as boolean;
}

/** How many tasks the pool has finished in this process (for tests: was a result computed or remembered?). */
export function heavyTasksCompleted(): number {
  return holder.__quadrilleHeavyPool?.completed ?? 0;
}
