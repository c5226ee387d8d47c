#!/usr/bin/env node
// `npm test`: type check, lint, client build (the browser tests load it), then every test.
// The last line printed is Vitest's `N passed, N failed` from tests/helpers/count-reporter.ts.
import { spawnSync } from 'node:child_process';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensure } from './db.mjs';

const projectDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const urls = ensure();
const env = { ...process.env, NODE_ENV: 'test', TEST_DATABASE_URL: process.env.TEST_DATABASE_URL ?? urls.test };

function step(name, args) {
  process.stderr.write(`[test] ${name}\n`);
  const res = spawnSync(process.execPath, args, { cwd: projectDir, stdio: 'inherit', env });
  if (res.status !== 0) {
    process.stderr.write(`[test] ${name} failed\n`);
    process.stdout.write('\n0 passed, 1 failed\n');
    process.exit(res.status ?? 1);
  }
}

step('type check', ['node_modules/typescript/bin/tsc', '--noEmit', '-p', 'tsconfig.json']);
step('lint and format', ['node_modules/@biomejs/biome/bin/biome', 'check', '.']);
step('client build', ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn']);
const extra = process.argv.slice(2);
const res = spawnSync(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', ...extra], {
  cwd: projectDir,
  stdio: 'inherit',
  env,
});
process.exit(res.status ?? 1);
