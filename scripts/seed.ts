// `npm run db:seed`: the demo world (docs/demo-scenario.md) into DATABASE_URL or the project database.
import { createDb } from '../server/db/client';
import { runMigrations } from '../server/db/migrate';
import { seedDemo } from '../server/db/seed';
// @ts-expect-error plain-Node script without types
import { ensure } from './db.mjs';

const url: string = process.env.DATABASE_URL ?? (ensure() as { app: string }).app;
const { db, pool } = createDb(url, 2);
await runMigrations(db);
await seedDemo(db);
await pool.end();
console.log('demo data in place');
