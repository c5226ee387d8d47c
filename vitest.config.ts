import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
    },
  },
  test: {
    include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
    environment: 'node',
    globalSetup: ['tests/helpers/global-setup.ts'],
    setupFiles: ['tests/helpers/fast-check-seed.ts'],
    testTimeout: 30_000,
    hookTimeout: 120_000,
    reporters: ['default', './tests/helpers/count-reporter.ts'],
    pool: 'forks',
    maxWorkers: 2,
  },
});
