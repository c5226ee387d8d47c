#!/usr/bin/env node
// Runs before `npm start` and `npm test`: installs the npm packages when they are missing or
// older than the lockfile. Plain Node, since nothing is installed yet on a fresh clone.
import { execSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const projectDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const marker = join(projectDir, 'node_modules', '.package-lock.json');
const lock = join(projectDir, 'package-lock.json');

const stale = !existsSync(marker) || (existsSync(lock) && statSync(lock).mtimeMs > statSync(marker).mtimeMs + 1000);
if (stale) {
  process.stderr.write('[prepare] installing npm packages (npm ci)\n');
  execSync('npm ci --no-audit --no-fund', { cwd: projectDir, stdio: 'inherit' });
}
