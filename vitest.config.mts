import path from 'node:path';
import { defineConfig } from 'vitest/config';

const root = import.meta.dirname;
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
          include: ['tests/integration/**/*.test.ts'],
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
          include: ['tests/integration/**/*.test.ts'],
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
          include: ['tests/e2e/**/*.test.ts'],
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
