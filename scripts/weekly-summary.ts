// `npm run studio:summary`: sends every studio's weekly summary to its teacher now (even if this
// week's already went out). Mail goes over SMTP as the environment says (the local fake outside
// production, to the running server's fake or to one this command starts).
import { createDb } from '../server/db/client';
import { parseEnv } from '../server/env';
import { type FakeSmtp, startFakeSmtp } from '../server/mail/fake-smtp';
import { mailerFromEnv } from '../server/mail/mailer';
import { sendWeeklySummaries } from '../server/services/studios/weekly-summary';
// @ts-expect-error plain-Node script without types
import { ensure } from './db.mjs';

const url: string = process.env.DATABASE_URL ?? (ensure() as { app: string }).app;
const env = parseEnv({ ...process.env, DATABASE_URL: url });
const origin = env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`;
const { db, pool } = createDb(url, 2);
// Outside production, with no server running, this command runs the fake SMTP server itself.
let fake: FakeSmtp | null = null;
if (env.NODE_ENV !== 'production') {
  fake = await startFakeSmtp({ db, port: env.SMTP_PORT, host: env.SMTP_HOST }).catch(() => null);
}
try {
  const run = await sendWeeklySummaries(db, mailerFromEnv(env), { origin, force: true });
  console.log(
    run.locked
      ? 'another instance is sending the summaries right now; nothing sent'
      : `sent ${run.sent} weekly summaries (week of ${run.week})`,
  );
} finally {
  await fake?.close();
  await pool.end();
}
