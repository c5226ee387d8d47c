import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { weeklySummaries } from '../../server/db/schema';
import { type FakeSmtp, startFakeSmtp } from '../../server/mail/fake-smtp';
import { createSmtpMailer, type Mailer } from '../../server/mail/mailer';
import { sendWeeklySummaries, weekOf } from '../../server/services/studios/weekly-summary';
import { type Client, createStudio, createUser, signedIn, waitForMail } from '../helpers/factories';
import { postTake, STUDIO_SPEC } from '../helpers/studio-fixtures';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(async () => {
  await fake?.close();
  await ctx.close();
});

let admin: Client;
let teacherEmail: string;
let studioId: string;
let fake: FakeSmtp;
let mailer: Mailer;

beforeAll(async () => {
  const teacher = await createUser(ctx.db, { role: 'teacher', name: 'Mara Quill' });
  teacherEmail = teacher.email;
  const player = await createUser(ctx.db, { role: 'player', name: 'Theo Park' });
  studioId = (await createStudio(ctx.db, teacher.id, [player.id], 'Summary studio')).id;
  admin = await signedIn(ctx.app, await createUser(ctx.db, { role: 'admin' }));
  await postTake(await signedIn(ctx.app, player), STUDIO_SPEC);
  fake = await startFakeSmtp({ db: ctx.db, port: 0 });
  mailer = createSmtpMailer({ host: '127.0.0.1', port: fake.port, from: ctx.env.MAIL_FROM });
});

describe('the weekly summary', () => {
  it('weeks start on Monday (UTC)', () => {
    expect(weekOf(new Date('2026-12-02T10:00:00Z'))).toBe('2026-11-30');
    expect(weekOf(new Date('2026-11-30T00:00:00Z'))).toBe('2026-11-30');
    expect(weekOf(new Date('2026-12-06T23:59:00Z'))).toBe('2026-11-30');
  });

  it('two instances running at once send each teacher one e-mail; a later run that week sends none', async () => {
    const run = () => sendWeeklySummaries(ctx.db, mailer, { origin: 'http://sixfold.test' });
    const [x, y] = await Promise.all([run(), run()]);
    // one run sent; the other found the lock held, or (had it come later) the week's rows written
    expect([x, y].filter((r) => r.sent > 0)).toHaveLength(1);
    const mail = await waitForMail(admin, teacherEmail);
    await new Promise((r) => setTimeout(r, 500));
    expect(await waitForMail(admin, teacherEmail)).toHaveLength(1);
    expect(mail[0].subject).toContain('Summary studio');
    expect(mail[0].text).toContain('Theo Park: 1 take, accuracy 100%');
    expect(mail[0].text).toContain(`http://sixfold.test/studio/${studioId}`);
    // (other test files may add studios meanwhile, so count this teacher's mail, not the run's)
    const again = await run();
    expect(again.locked).toBe(false);
    await new Promise((r) => setTimeout(r, 500));
    expect(await waitForMail(admin, teacherEmail)).toHaveLength(1);
    const rows = await ctx.db.select().from(weeklySummaries).where(eq(weeklySummaries.studioId, studioId));
    expect(rows).toHaveLength(1);
  });
});
