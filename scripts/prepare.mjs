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

// The browser tests drive Debian's Chromium (never a downloaded browser): install it when it is
// missing, as scripts/db.mjs does for PostgreSQL. Without root, say how and carry on (the
// browser tests then fail with a message naming the missing browser).
const chromiumPath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
if (!existsSync(chromiumPath)) {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (isRoot && !process.env.CHROMIUM_PATH) {
    process.stderr.write("[prepare] installing Debian's chromium package (once, for the browser tests)\n");
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    try {
      execSync('apt-get update -qq && apt-get install -y -qq chromium', { stdio: 'inherit', env });
    } catch {
      process.stderr.write('[prepare] chromium could not be installed; the browser tests will fail until it is\n');
    }
  } else {
    process.stderr.write(
      `[prepare] Chromium is not at ${chromiumPath}: install Debian's package (sudo apt-get install -y chromium) or set CHROMIUM_PATH; the browser tests need it\n`,
    );
  }
}
