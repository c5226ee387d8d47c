import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The project folder: the nearest folder above this module that holds package.json. The same
 * answer whether the server runs from its sources (server/) or from the build (dist/server/).
 */
function findProjectRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (;;) {
    if (existsSync(join(dir, 'package.json'))) return dir;
    const up = dirname(dir);
    if (up === dir) return process.cwd();
    dir = up;
  }
}

export const projectRoot = findProjectRoot();

/** The built client, served for every non-API path; CLIENT_DIR lets a second build be tested. */
export const clientDir = (): string => process.env.CLIENT_DIR ?? join(projectRoot, 'dist', 'client');

/** The generated SQL migrations. */
export const migrationsDir = join(projectRoot, 'drizzle');
