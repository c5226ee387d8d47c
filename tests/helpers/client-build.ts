import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const projectDir = resolve(fileURLToPath(new URL('../..', import.meta.url)));
const sources = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'];

function newest(path: string): number {
  if (!existsSync(path)) return 0;
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  let latest = 0;
  for (const entry of readdirSync(path)) latest = Math.max(latest, newest(join(path, entry)));
  return latest;
}

/**
 * Before the browser tests: the client they load is built from the sources as they are now.
 * A build older than any client source is rebuilt; CLIENT_DIR (a build of the caller's own)
 * is used as given.
 */
export default function setup() {
  if (process.env.CLIENT_DIR) return;
  const built = join(projectDir, 'dist', 'client', 'index.html');
  const builtAt = existsSync(built) ? statSync(built).mtimeMs : 0;
  const changedAt = Math.max(...sources.map((s) => newest(join(projectDir, s))));
  if (builtAt >= changedAt) return;
  process.stderr.write('[test] the client build is older than its sources: building it\n');
  // The tests run with NODE_ENV=test; the client is built as it ships (React's production build).
  const res = spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], {
    cwd: projectDir,
    env: { ...process.env, NODE_ENV: 'production' },
    stdio: 'inherit',
  });
  if (res.status !== 0) throw new Error('The client build failed, so the browser tests cannot run (see above).');
}
