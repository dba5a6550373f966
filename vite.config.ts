import { defineConfig } from 'vitest/config';

/**
 * The vitest projects that `npm test` runs. Each workspace keeps its tests beside its code
 * (in `__tests__/` folders or `test/`); this file only says where they are and which
 * environment they need. The server and browser projects expect PostgreSQL and maildev,
 * which scripts/test.mjs starts before vitest and stops after.
 */
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'calc',
          root: './packages/calc',
          environment: 'node',
          include: ['src/**/*.test.ts', 'test/**/*.test.ts'],
          testTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'shared',
          root: './packages/shared',
          environment: 'node',
          include: ['src/**/*.test.ts'],
        },
      },
      {
        test: {
          name: 'server',
          root: './apps/server',
          environment: 'node',
          include: ['src/**/*.test.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
          // API tests share one database per run; files run one after another so their
          // fixtures never race.
          fileParallelism: false,
        },
      },
      './apps/web/vite.config.ts',
      {
        test: {
          name: 'e2e',
          root: './tests',
          environment: 'node',
          include: ['**/*.test.ts'],
          exclude: ['node_modules/**'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
