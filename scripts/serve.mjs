#!/usr/bin/env node
// `npm run serve`: the built server (from `npm run build`) in production mode. No tsx, no
// rebuild; it refuses to start, naming each one, while a required setting is missing.
import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const projectDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const entry = process.env.SERVER_ENTRY ?? join(projectDir, 'dist', 'server', 'index.js');
if (!existsSync(entry) || !existsSync(join(projectDir, 'dist', 'client', 'index.html'))) {
  process.stderr.write('Nothing to serve yet: run `npm run build` first (it builds dist/client and dist/server)\n');
  process.exit(1);
}
process.env.NODE_ENV = 'production';
await import(pathToFileURL(entry).href);
