import { createApp } from './app';
import { createDb } from './db/client';
import { runMigrations } from './db/migrate';
import { seedDemo } from './db/seed';
import { type Env, EnvError, parseEnv } from './env';
import { type FakeSmtp, startFakeSmtp } from './mail/fake-smtp';
import { mailerFromEnv } from './mail/mailer';
import { paymentsEndpoint } from './payments/client';
import { type FakeCheckout, startFakeCheckout } from './payments/fake-checkout';
import { scheduleWeeklySummaries } from './services/studios/weekly-summary';

/** Outside production the server runs its own fake SMTP server; another instance's is reused. */
async function startMailFake(env: Env, db: ReturnType<typeof createDb>['db']): Promise<FakeSmtp | null> {
  if (env.NODE_ENV === 'production') return null;
  try {
    const fake = await startFakeSmtp({ db, port: env.SMTP_PORT, host: env.SMTP_HOST });
    console.log(
      `Mail goes to a local fake SMTP server on ${env.SMTP_HOST}:${fake.port}; admins read it at /api/dev/outbox`,
    );
    return fake;
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'EADDRINUSE') {
      console.log(`Port ${env.SMTP_PORT} is taken (another Sixfold's fake SMTP server?); sending mail there`);
      return null;
    }
    throw err;
  }
}

/** Outside production the server runs the local checkout fake too; another instance's is reused. */
async function startPaymentsFake(env: Env): Promise<FakeCheckout | null> {
  if (env.NODE_ENV === 'production') return null;
  const { host, port } = paymentsEndpoint(env);
  try {
    const fake = await startFakeCheckout({
      host,
      port,
      secretKey: env.STRIPE_SECRET_KEY,
      webhookSecret: env.STRIPE_WEBHOOK_SECRET,
      webhookUrl: `http://${env.HOST}:${env.PORT}/api/payments/webhook`,
    });
    console.log(`Checkout goes to a local payment fake at ${fake.url}; no money moves`);
    return fake;
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'EADDRINUSE') {
      console.log(`Port ${port} is taken (another Sixfold's payment fake?); checkout goes there`);
      return null;
    }
    throw err;
  }
}

async function main() {
  let env: Env;
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
  const fake = await startMailFake(env, db);
  const paymentsFake = await startPaymentsFake(env);
  if (env.NODE_ENV === 'production' && !env.PUBLIC_URL) {
    console.warn('PUBLIC_URL is not set: password-reset e-mails will not be sent until it is');
  }

  const app = createApp({ db, pool, env });
  // Hourly, every instance tries; an advisory lock and a row per studio and week make it once.
  const stopSummaries = scheduleWeeklySummaries(
    db,
    mailerFromEnv(env),
    env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`,
  );
  const server = app.listen(env.PORT, env.HOST, () => {
    const url = `http://${env.HOST}:${env.PORT}`;
    console.log(`\nSixfold is running at ${url}\n`);
    console.log('Demo sign-ins (password sixfold-demo):');
    for (const who of ['admin', 'teacher', 'player', 'alto', 'wind']) console.log(`  ${who}@sixfold.test`);
    console.log('');
  });
  const shutdown = () => {
    stopSummaries();
    server.close();
    Promise.allSettled([fake?.close(), paymentsFake?.close()]).finally(() => pool.end().finally(() => process.exit(0)));
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

main().catch((err) => {
  console.error('Sixfold could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
