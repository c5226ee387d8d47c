#!/usr/bin/env node
// `npm test`: type check, lint and format, then every test: unit, server (the real PostgreSQL)
// and browser (Chromium; the client is rebuilt first when older than its sources).
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

// Incremental: a second run re-checks only what changed since the last one.
step('type check', [
  'node_modules/typescript/bin/tsc',
  '--noEmit',
  '--incremental',
  '--tsBuildInfoFile',
  'node_modules/.cache/sixfold-tsc.tsbuildinfo',
  '-p',
  'tsconfig.json',
]);
step('lint and format', ['node_modules/@biomejs/biome/bin/biome', 'check', '.']);
// The browser project's set-up (tests/helpers/client-build.ts) rebuilds the client when stale.
const extra = process.argv.slice(2);
const res = spawnSync(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', ...extra], {
  cwd: projectDir,
  stdio: 'inherit',
  env,
});
process.exit(res.status ?? 1);
