import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { createDb } from '../../server/db/client';
import { parseEnv } from '../../server/env';

/** An app on the real test database, as each server test file uses it. */
export function createTestApp(overrides: Record<string, string> = {}) {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set (the global set-up sets it)');
  const env = parseEnv({ ...process.env, NODE_ENV: 'test', DATABASE_URL: url, ...overrides });
  const { db, pool } = createDb(url, 4);
  const app = createApp({ db, pool, env });
  return { app, db, pool, env, close: () => pool.end() };
}

/** The same app listening on a free loopback port, for browser tests. */
export async function startTestServer(overrides: Record<string, string> = {}) {
  const ctx = createTestApp(overrides);
  const server = ctx.app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  const { port } = server.address() as AddressInfo;
  return {
    ...ctx,
    url: `http://127.0.0.1:${port}`,
    async stop() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await ctx.pool.end();
    },
  };
}
