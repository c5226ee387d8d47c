#!/usr/bin/env node
// `npm start`: the database, the client build, then the server (which migrates and seeds).
import { spawn, spawnSync } from 'node:child_process';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensure } from './db.mjs';

const projectDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const urls = ensure();

process.stderr.write('[start] building the client\n');
const build = spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], {
  cwd: projectDir,
  stdio: 'inherit',
});
if (build.status !== 0) process.exit(build.status ?? 1);

const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
  cwd: projectDir,
  stdio: 'inherit',
  env: { NODE_ENV: 'development', SEED_DEMO: '1', ...process.env, DATABASE_URL: urls.app },
});
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => server.kill(sig));
server.on('exit', (code) => process.exit(code ?? 0));
