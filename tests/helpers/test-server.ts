import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { createDb } from '../../server/db/client';
import { parseEnv } from '../../server/env';
import { type FakeSmtp, startFakeSmtp } from '../../server/mail/fake-smtp';
import { createSmtpMailer } from '../../server/mail/mailer';
import { startFakeCheckout } from '../../server/payments/fake-checkout';
import { checkResponseContracts } from './response-contract';

/**
 * An app on the real test database, as each server test file uses it. Mail goes through
 * nodemailer to a fake SMTP server on a free loopback port (started on the first e-mail),
 * which files it in the shared dev_outbox table.
 *
 * All tests reach the app from 127.0.0.1, so the per-source limits (sign-in failures, sign-ups,
 * reset requests) are raised here; the rate-limit test sets its own, with TRUST_PROXY=1 and an
 * X-Forwarded-For of its own.
 */
export function createTestApp(overrides: Record<string, string> = {}) {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set (the global set-up sets it)');
  const env = parseEnv({
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: url,
    SIGN_IN_IP_LIMIT: '10000',
    SIGN_UP_IP_LIMIT: '10000',
    RESET_IP_LIMIT: '10000',
    ...overrides,
  });
  const { db, pool } = createDb(url, 4);
  let fake: Promise<FakeSmtp> | undefined;
  const startFake = () => {
    fake ??= startFakeSmtp({ db, port: 0 });
    return fake;
  };
  const mailer = createSmtpMailer({
    host: '127.0.0.1',
    port: async () => (await startFake()).port,
    from: env.MAIL_FROM,
  });
  const app = createApp({ db, pool, env, mailer });
  // Every 2xx JSON answer is parsed with its route's schema; the server tests fail on a mismatch.
  checkResponseContracts(app);
  return {
    app,
    db,
    pool,
    env,
    async close() {
      if (fake) await (await fake).close();
      await pool.end();
    },
  };
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
      await ctx.close();
    },
  };
}

/**
 * The local checkout fake on a free loopback port, with the keys the test app uses. Pass
 * `PAYMENTS_API_PORT: String(fake.port)` to the app, then `fake.setWebhookUrl(...)` once it listens.
 */
export function startPaymentsFake() {
  const env = parseEnv({
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: process.env.TEST_DATABASE_URL ?? 'postgres://unused',
  });
  return startFakeCheckout({ port: 0, secretKey: env.STRIPE_SECRET_KEY, webhookSecret: env.STRIPE_WEBHOOK_SECRET });
}
