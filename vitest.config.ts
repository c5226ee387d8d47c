import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

/** Tests that need neither the database nor a browser: the engine, the listener, client rules. */
const unitTests = ['tests/engine/**/*.test.ts', 'tests/client/**/*.test.ts', 'tests/audio/**/*.test.ts'];

export default defineConfig({
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
    },
  },
  test: {
    environment: 'node',
    setupFiles: ['tests/helpers/fast-check-seed.ts'],
    testTimeout: 30_000,
    hookTimeout: 120_000,
    reporters: ['default', './tests/helpers/count-reporter.ts'],
    pool: 'forks',
    maxWorkers: 2,
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: unitTests,
          // Pure modules with no shared state: one module graph for all files is safe and fast.
          isolate: false,
        },
      },
      {
        extends: true,
        test: {
          name: 'server',
          include: ['tests/server/**/*.test.ts'],
          // Added to the root's setup files: a test fails on an answer its response schema refuses.
          setupFiles: ['tests/helpers/response-contract-setup.ts'],
          globalSetup: ['tests/helpers/global-setup.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          include: ['tests/e2e/**/*.test.ts'],
          // The pages' requests go through the same checked app as the API tests.
          setupFiles: ['tests/helpers/response-contract-setup.ts'],
          globalSetup: ['tests/helpers/global-setup.ts', 'tests/helpers/client-build.ts'],
        },
      },
    ],
  },
});
