// `npm run studio:summary`: sends every studio's weekly summary to its teacher now (even if this
// week's already went out). Mail goes over SMTP as the environment says (outside production with
// no relay named, to a fake of its own).
import { createDb } from '../server/db/client';
import { parseEnv } from '../server/env';
import { type FakeSmtp, startFakeSmtp } from '../server/mail/fake-smtp';
import { localOrigin } from '../server/mail/link-origin';
import { createSmtpMailer, mailerFromEnv } from '../server/mail/mailer';
import { sendWeeklySummaries } from '../server/services/studios/weekly-summary';
// @ts-expect-error plain-Node script without types
import { ensure } from './db.mjs';

const url: string = process.env.DATABASE_URL ?? (ensure() as { app: string }).app;
const env = parseEnv({ ...process.env, DATABASE_URL: url });
const origin = env.PUBLIC_URL ?? localOrigin(env);
const { db, pool } = createDb(url, 2);
// Outside production with no relay named, this command runs a fake SMTP server of its own (on a
// free port), which files the mail in this database's outbox like the server's does.
let fake: FakeSmtp | null = null;
if (env.NODE_ENV !== 'production' && !env.SMTP_HOST && !env.SMTP_PORT) {
  fake = await startFakeSmtp({ db, port: 0 });
}
const mailer = fake
  ? createSmtpMailer({ host: '127.0.0.1', port: fake.port, from: env.MAIL_FROM })
  : mailerFromEnv(env);
try {
  const run = await sendWeeklySummaries(db, mailer, { origin, force: true });
  console.log(
    run.locked
      ? 'another instance is sending the summaries right now; nothing sent'
      : `sent ${run.sent} weekly summaries (week of ${run.week})`,
  );
} finally {
  await fake?.close();
  await pool.end();
}
