import path from 'node:path';
import { defineConfig } from 'vitest/config';

const root = import.meta.dirname;
// The standing attack suites (tests/soak): in-process ones join the integration projects, those that
// need real server processes join e2e (and its one build). Checks whose fix has not landed yet wait in
// tests/soak/pending until moved beside the others; SOAK_PENDING=1 runs them where they will go.
const pending = process.env.SOAK_PENDING === '1';

const alias = {
  '@': root,
  // 'server-only' throws outside React's server build; in tests it is a no-op.
  'server-only': path.join(root, 'tests/support/empty-module.ts'),
};

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.{ts,tsx}'],
          environment: 'node',
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: [
            'tests/integration/**/*.test.ts',
            'tests/soak/in-process/**/*.test.ts',
            ...(pending ? ['tests/soak/pending/in-process/**/*.test.ts'] : []),
          ],
          environment: 'node',
          setupFiles: ['tests/support/close-db.ts'],
          testTimeout: 30_000,
        },
      },
      {
        // The same integration suite on PostgreSQL (a throwaway cluster started by the setup).
        resolve: { alias },
        test: {
          name: 'integration-pg',
          include: [
            'tests/integration/**/*.test.ts',
            'tests/soak/in-process/**/*.test.ts',
            ...(pending ? ['tests/soak/pending/in-process/**/*.test.ts'] : []),
          ],
          environment: 'node',
          setupFiles: ['tests/support/close-db.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
          globalSetup: ['tests/support/pg-global-setup.ts'],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts', 'tests/soak/servers/**/*.test.ts', ...(pending ? ['tests/soak/pending/servers/**/*.test.ts'] : [])],
          environment: 'node',
          globalSetup: ['tests/e2e/global-setup.ts'],
          testTimeout: 90_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
