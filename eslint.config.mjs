// Lint: Next's rules (core web vitals, React hooks), TypeScript's recommended set,
// and the layering rule that keeps the pure core pure (DEVELOPERS.md, "Layers").
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

// The pure domain core: geometry, strokes, review findings, planning, gag rules.
const PURE_CORE = [
  'lib/print/**',
  'lib/strokes/**',
  'lib/review/**',
  'lib/planning/**',
  'lib/gags/**',
  'lib/validation/**',
  'lib/refused.ts',
  'lib/counted.ts',
];

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: ['.next/**', '.next-*/**', 'node_modules/**', 'data/**', 'next-env.d.ts', 'public/**'],
  },
  {
    rules: {
      // An unused value is a bug or dead code; a leading underscore says "on purpose".
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    // Migrations and the dialect helpers work on any schema (Kysely<any>), by Kysely's own
    // advice: a frozen migration must not depend on today's Database type.
    files: ['db/migrations/**', 'db/dialect.ts', 'db/notify.ts', 'db/client.ts', 'db/queries/pass-items.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    // Tests and their helpers are not React: `use…` names there are not hooks. They read
    // JSON answers and route params loosely, as a client would.
    files: ['tests/**'],
    rules: { 'react-hooks/rules-of-hooks': 'off', '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: PURE_CORE,
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['@/db/*', '@/db', '../db/*', '**/db/*'], message: 'The pure core imports nothing from the database layer.' },
            { group: ['next', 'next/*', 'next-auth', 'next-auth/*'], message: 'The pure core imports nothing from Next.' },
            {
              group: ['react', 'react-dom', 'react/*', 'swr', 'konva', 'react-konva'],
              message: 'The pure core imports nothing from React or the canvas.',
            },
            {
              group: [
                '@/lib/auth/*',
                // The role table is plain data, shared by the UI and the guard.
                '!@/lib/auth/permissions',
                '@/lib/http/*',
                '@/lib/live/*',
                '@/lib/mail/*',
                '@/lib/storage/*',
                '@/lib/data/*',
                '@/lib/uploads/*',
                '@/lib/export/*',
                '@/components/*',
                '@/hooks/*',
                '@/app/*',
              ],
              message: 'The pure core imports no server service and no UI.',
            },
            { group: ['server-only', 'node:*'], message: 'The pure core runs anywhere: no server-only or Node modules.' },
          ],
        },
      ],
    },
  },
];

export default config;
