// Each test file closes the shared connection it opened, so pools do not outlive their file.
import { afterAll } from 'vitest';
import { closeDb } from '@/db/client';

afterAll(async () => {
  await closeDb();
});
