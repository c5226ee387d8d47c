#!/usr/bin/env node
// `npm run test:server` / `npm run test:browser`: one Vitest project, with the project's own
// PostgreSQL started first (as `npm test` does), without the type check and lint steps.
import { spawnSync } from 'node:child_process';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensure } from './db.mjs';

const projectDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const [project, ...extra] = process.argv.slice(2);
const urls = process.env.TEST_DATABASE_URL ? null : ensure();
const env = { ...process.env, NODE_ENV: 'test', TEST_DATABASE_URL: process.env.TEST_DATABASE_URL ?? urls.test };
const res = spawnSync(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', '--project', project, ...extra], {
  cwd: projectDir,
  stdio: 'inherit',
  env,
});
process.exit(res.status ?? 1);
