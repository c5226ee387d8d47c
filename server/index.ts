import { createApp } from './app';
import { createDb } from './db/client';
import { runMigrations } from './db/migrate';
import { seedDemo } from './db/seed';
import { EnvError, parseEnv } from './env';

async function main() {
  let env: ReturnType<typeof parseEnv>;
  try {
    env = parseEnv();
  } catch (err) {
    if (err instanceof EnvError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
  const { db, pool } = createDb(env.DATABASE_URL);
  await runMigrations(db);
  if (env.SEED_DEMO === '1') await seedDemo(db);

  const app = createApp({ db, pool, env });
  const server = app.listen(env.PORT, env.HOST, () => {
    const url = `http://${env.HOST}:${env.PORT}`;
    console.log(`\nSixfold is running at ${url}\n`);
    console.log('Demo sign-ins (password sixfold-demo):');
    for (const who of ['admin', 'teacher', 'player', 'alto', 'wind']) console.log(`  ${who}@sixfold.test`);
    console.log('');
  });
  const shutdown = () => {
    server.close();
    pool.end().finally(() => process.exit(0));
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

main().catch((err) => {
  console.error('Sixfold could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
