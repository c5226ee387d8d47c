import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema';

export type Db = ReturnType<typeof createDb>['db'];

export function createDb(url: string, max = 10) {
  const pool = new pg.Pool({ connectionString: url, max, connectionTimeoutMillis: 5000 });
  // An idle client losing its connection (a restarted database) must not crash the server.
  pool.on('error', (err) => console.error('[db] idle client error:', err.message));
  const db = drizzle(pool, { schema });
  return { db, pool };
}
