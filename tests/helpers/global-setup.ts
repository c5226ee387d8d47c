import pg from 'pg';
import { createDb } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
// @ts-expect-error plain-Node script without types
import { ensure } from '../../scripts/db.mjs';

/**
 * Once per `vitest run`: the project's PostgreSQL is up, and the test database starts empty
 * and freshly migrated, so every run begins from the same state.
 */
export default async function setup() {
  // The server and browser projects both list this set-up; the database is emptied once a run.
  if (process.env.SIXFOLD_TEST_DB_READY === '1') return;
  const url: string = process.env.TEST_DATABASE_URL ?? (ensure() as { test: string }).test;
  process.env.TEST_DATABASE_URL = url;
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  await client.query(
    'DROP SCHEMA IF EXISTS public CASCADE; DROP SCHEMA IF EXISTS drizzle CASCADE; CREATE SCHEMA public;',
  );
  await client.end();
  const { db, pool } = createDb(url, 2);
  await runMigrations(db);
  await pool.end();
  process.env.SIXFOLD_TEST_DB_READY = '1';
}
