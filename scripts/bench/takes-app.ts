/**
 * The app for the takes-load bench, in a process of its own like a real server: the load
 * generator's own work never shares this event loop. Started by takes-load.ts with fork();
 * answers its port over IPC and stops when its parent disconnects.
 */
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { createDb } from '../../server/db/client';
import { parseEnv } from '../../server/env';

const url = process.env.BENCH_DATABASE_URL;
if (!url || !process.send) throw new Error('takes-app runs under takes-load (fork with BENCH_DATABASE_URL)');
const { db, pool } = createDb(url, 10);
const env = parseEnv({ ...process.env, NODE_ENV: 'test', DATABASE_URL: url, SIGN_IN_IP_LIMIT: '100000' });
const server = createApp({ db, pool, env }).listen(0, '127.0.0.1', () => {
  process.send?.({ port: (server.address() as AddressInfo).port });
});
process.on('disconnect', () => {
  server.close();
  void pool.end().then(() => process.exit(0));
});
