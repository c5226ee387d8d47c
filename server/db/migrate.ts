import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { migrationsDir } from '../paths';
import type { Db } from './client';

export const migrationsFolder = migrationsDir;

/** The advisory-lock key that makes migrating a one-at-a-time job across every instance. */
export const MIGRATION_LOCK_KEY = 0x5f_1f_0d_01;

/**
 * Applies the migrations in drizzle/ (safe to rerun: applied ones are skipped). Runs under a
 * PostgreSQL advisory lock held on one connection, so instances starting together take turns:
 * the first applies, the others wait and then find nothing left to do.
 */
export async function runMigrations(db: Db): Promise<void> {
  const client = await db.$client.connect();
  try {
    await client.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    try {
      await migrate(drizzle(client), { migrationsFolder });
    } finally {
      await client.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]);
    }
  } finally {
    client.release();
  }
}
