#!/usr/bin/env node
// `npm run dev`: the API server (restarting on change) and Vite's dev server, which proxies /api.
import { spawn } from 'node:child_process';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensure } from './db.mjs';

const projectDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const urls = ensure();
// Links in e-mails and checkout's way back open Vite's page, where the changes show.
const env = {
  NODE_ENV: 'development',
  SEED_DEMO: '1',
  PUBLIC_URL: 'http://127.0.0.1:5173',
  ...process.env,
  DATABASE_URL: urls.app,
};
const children = [
  spawn(process.execPath, ['--import', 'tsx', '--watch', 'server/index.ts'], {
    cwd: projectDir,
    stdio: 'inherit',
    env,
  }),
  spawn(process.execPath, ['node_modules/vite/bin/vite.js'], { cwd: projectDir, stdio: 'inherit', env }),
];
const stopAll = () => {
  for (const c of children) c.kill('SIGTERM');
};
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, stopAll);
for (const c of children)
  c.on('exit', (code) => {
    stopAll();
    process.exit(code ?? 0);
  });
