// Each test file closes the shared connection it opened, and the worker pool
// it started, so neither outlives its file.
import { afterAll } from 'vitest';
import { closeDb } from '@/db/client';
import { closeHeavyPool } from '@/lib/workers/pool';

afterAll(async () => {
  await closeHeavyPool();
  await closeDb();
});
