#!/usr/bin/env node
// `npm run build`: the client (Vite, into dist/client) and the server (esbuild, one ES module
// in dist/server/index.js that plain Node runs: no tsx, no TypeScript at run time). npm
// packages stay outside the bundle and load from node_modules. `npm run serve` starts it.
//
//   node scripts/build.mjs            # both
//   node scripts/build.mjs server     # the server only (OUT_DIR to build it elsewhere)
import { spawnSync } from 'node:child_process';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const projectDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const only = process.argv[2];

if (only !== 'server') {
  process.stderr.write('[build] client (vite)\n');
  // Always the production build of the client, whatever NODE_ENV the caller runs under.
  const res = spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], {
    cwd: projectDir,
    env: { ...process.env, NODE_ENV: 'production' },
    stdio: 'inherit',
  });
  if (res.status !== 0) process.exit(res.status ?? 1);
}

const outDir = process.env.OUT_DIR ?? join(projectDir, 'dist', 'server');
process.stderr.write('[build] server (esbuild)\n');
await build({
  absWorkingDir: projectDir,
  entryPoints: { index: 'server/index.ts' },
  outdir: outDir,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  sourcemap: true,
  logLevel: 'warning',
});
process.stderr.write(`[build] done: ${join(outDir, 'index.js')}\n`);
