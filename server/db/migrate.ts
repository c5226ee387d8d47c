import { fileURLToPath } from 'node:url';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import type { Db } from './client';

export const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url));

/** Applies the migrations in drizzle/ (safe to rerun: applied ones are skipped). */
export async function runMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder });
}
