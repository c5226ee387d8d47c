import { randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { createDb, type Db } from './db/client';
import { runMigrations } from './db/migrate';
import { seedDemo } from './db/seed';
import { type Env, EnvError, parseEnv } from './env';
import { type FakeSmtp, startFakeSmtp } from './mail/fake-smtp';
import { localOrigin } from './mail/link-origin';
import { createSmtpMailer, type Mailer, mailerFromEnv } from './mail/mailer';
import { type FakeCheckout, startFakeCheckout } from './payments/fake-checkout';
import { scheduleWeeklySummaries } from './services/studios/weekly-summary';

/**
 * Outside production, with no relay named (SMTP_HOST/SMTP_PORT unset), this instance runs a
 * fake SMTP server of its own on a free loopback port and only its own mailer knows the port,
 * so a second Sixfold on the machine never sends its mail here, nor this one there.
 */
async function startMail(env: Env, db: Db): Promise<{ mailer: Mailer; fake: FakeSmtp | null }> {
  if (env.NODE_ENV === 'production' || env.SMTP_HOST || env.SMTP_PORT) {
    return { mailer: mailerFromEnv(env), fake: null };
  }
  const fake = await startFakeSmtp({ db, port: 0, host: '127.0.0.1' });
  console.log(
    `Mail goes to this server's own fake SMTP server (127.0.0.1:${fake.port}); admins read it at /api/dev/outbox`,
  );
  return { mailer: createSmtpMailer({ host: '127.0.0.1', port: fake.port, from: env.MAIL_FROM }), fake };
}

/**
 * Outside production, with no payment API named, the checkout fake runs on a free loopback
 * port of this instance's own, with a webhook secret made for this run (unless one is set), so
 * its events reach this server only and no other installation's fake can sign one for it.
 */
async function startPayments(env: Env): Promise<{ env: Env; fake: FakeCheckout | null }> {
  if (env.NODE_ENV === 'production' || env.PAYMENTS_API_HOST || env.PAYMENTS_API_PORT !== undefined) {
    return { env, fake: null };
  }
  const webhookSecret = process.env.STRIPE_WEBHOOK_SECRET ?? `whsec_local_${randomBytes(16).toString('hex')}`;
  const fake = await startFakeCheckout({
    host: '127.0.0.1',
    port: 0,
    secretKey: env.STRIPE_SECRET_KEY,
    webhookSecret,
  });
  console.log(`Checkout goes to this server's own payment fake at ${fake.url}; no money moves`);
  return {
    env: {
      ...env,
      STRIPE_WEBHOOK_SECRET: webhookSecret,
      PAYMENTS_API_HOST: '127.0.0.1',
      PAYMENTS_API_PORT: fake.port,
      PAYMENTS_API_PROTOCOL: 'http',
    },
    fake,
  };
}

async function main() {
  let env: Env;
  try {
    env = parseEnv();
  } catch (err) {
    if (err instanceof EnvError) {
      console.error(`Sixfold will not start: ${err.message}`);
      process.exit(1);
    }
    throw err;
  }
  const { db, pool } = createDb(env.DATABASE_URL);
  await runMigrations(db);
  if (env.SEED_DEMO === '1') await seedDemo(db);
  const mail = await startMail(env, db);
  const payments = await startPayments(env);
  env = payments.env;

  const app = createApp({ db, pool, env, mailer: mail.mailer });
  const server = app.listen(env.PORT, env.HOST);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const origin = localOrigin(env, port);
  payments.fake?.setWebhookUrl(`${origin}/api/payments/webhook`);
  // Hourly, every instance tries; an advisory lock and a row per studio and week make it once.
  const stopSummaries = scheduleWeeklySummaries(db, mail.mailer, env.PUBLIC_URL ?? origin);

  console.log(`\nSixfold is running at ${origin}\n`);
  if (env.SEED_DEMO === '1') {
    console.log('Demo sign-ins (password sixfold-demo):');
    for (const who of ['admin', 'teacher', 'player', 'alto', 'wind']) console.log(`  ${who}@sixfold.test`);
    console.log('');
  }
  const shutdown = () => {
    stopSummaries();
    server.close();
    Promise.allSettled([mail.fake?.close(), payments.fake?.close()]).finally(() =>
      pool.end().finally(() => process.exit(0)),
    );
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

main().catch((err) => {
  const message = err instanceof Error ? err.message : String(err);
  console.error(
    (err as NodeJS.ErrnoException)?.code === 'EADDRINUSE'
      ? `Sixfold could not start: ${message} (another program has this port; set PORT to another)`
      : `Sixfold could not start: ${message}`,
  );
  process.exit(1);
});
