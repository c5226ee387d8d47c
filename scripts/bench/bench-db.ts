/**
 * The bench's own database (sixfold_bench) on the project's PostgreSQL: the 1,000,000-note
 * history and the load test's takes never reach the demo database.
 */
import pg from 'pg';
import { createDb } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
// @ts-expect-error plain-Node script without types
import { ensure } from '../db.mjs';

export const BENCH_DB = 'sixfold_bench';

export async function benchDatabase(max = 10) {
  const appUrl: string = (ensure() as { app: string }).app;
  const url = new URL(appUrl);
  url.pathname = `/${BENCH_DB}`;
  const admin = new pg.Client({ connectionString: appUrl });
  await admin.connect();
  const exists = await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [BENCH_DB]);
  if (exists.rowCount === 0) await admin.query(`CREATE DATABASE ${BENCH_DB}`);
  await admin.end();
  const { db, pool } = createDb(url.toString(), max);
  await runMigrations(db);
  return { db, pool, url: url.toString() };
}
