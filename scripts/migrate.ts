// `npm run db:migrate`: applies drizzle/ to DATABASE_URL, or to the project's own database.
import { createDb } from '../server/db/client';
import { runMigrations } from '../server/db/migrate';
// @ts-expect-error plain-Node script without types
import { ensure } from './db.mjs';

const url: string = process.env.DATABASE_URL ?? (ensure() as { app: string }).app;
const { db, pool } = createDb(url, 1);
await runMigrations(db);
await pool.end();
console.log('migrations applied');
