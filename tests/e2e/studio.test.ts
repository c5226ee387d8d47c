import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inAllKeys } from '../../shared/engine';
import { drillKey } from '../../shared/practice/drill-identity';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import {
  type Client,
  createStudio,
  createUser,
  signedIn,
  type TestUser,
  uniqueEmail,
  waitForMail,
} from '../helpers/factories';
import { createSavedDrill, STUDIO_SPEC } from '../helpers/studio-fixtures';
import { startTestServer } from '../helpers/test-server';

/**
 * The studio loop in Chromium: a teacher invites an address, the link from the fake's outbox
 * signs a new player up, the teacher sets a drill, the player plays it on the fake MIDI device
 * from the practice page, and the
 * teacher pins a remark to a missed note that the player then reads.
 */
describe('a studio in Chromium: invite, assign, take, remark', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let teacherBrowser: BrowserSession;
  let playerBrowser: BrowserSession;
  let teacher: TestUser;
  let admin: Client;
  let studioId: string;
  const playerEmail = uniqueEmail('invited');
  let inviteLink = '';
  let takeId = '';

  beforeAll(async () => {
    server = await startTestServer();
    teacher = await createUser(server.db, { role: 'teacher', name: 'Mara Quill' });
    studioId = (await createStudio(server.db, teacher.id, [], 'Harbour Lane Music Collective')).id;
    await createSavedDrill(server.db, teacher.id, STUDIO_SPEC, 'Four-three on D/C');
    admin = await signedIn(server.app, await createUser(server.db, { role: 'admin' }));
    teacherBrowser = await openBrowser(server.url);
    playerBrowser = await openBrowser(server.url, { fakeMidi: true });
  });
  afterAll(async () => {
    await teacherBrowser?.close();
    await playerBrowser?.close();
    await server?.stop();
  });

  async function signIn(b: BrowserSession, email: string, password: string, next: string) {
    await b.page.goto(`${server.url}/sign-in`, { waitUntil: 'networkidle' });
    await b.page.getByLabel('E-mail').fill(email);
    await b.page.getByLabel('Password').fill(password);
    await b.page.getByRole('button', { name: 'Sign in' }).click();
    await b.page.waitForURL(/\/home$/);
    await b.page.goto(`${server.url}${next}`, { waitUntil: 'networkidle' });
  }

  it('the teacher invites an address from the studio page; the e-mail carries the link', async () => {
    await signIn(teacherBrowser, teacher.email, teacher.password, `/studio/${studioId}`);
    const { page } = teacherBrowser;
    await page.getByRole('heading', { name: 'Harbour Lane Music Collective' }).waitFor();
    await page.getByLabel("Player's e-mail").fill(playerEmail);
    await page.getByRole('button', { name: 'Send invite' }).click();
    await page.getByText(`Invite sent to ${playerEmail}`).waitFor();
    const [mail] = await waitForMail(admin, playerEmail);
    expect(mail.to).toBe(playerEmail);
    inviteLink = mail.text.match(/https?:\/\/\S+\/invite\?token=[\w%-]+/)?.[0] ?? '';
    expect(inviteLink.startsWith(`${server.url}/invite?token=`)).toBe(true);
  });

  it('the invite link signs the new player up and into the studio', async () => {
    const { page } = playerBrowser;
    await page.goto(inviteLink, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { name: 'Join Harbour Lane Music Collective' }).waitFor();
    await page.getByLabel('Your name').fill('Sam Okafor');
    await page.getByLabel('Choose a password').fill('wind-controller-9');
    await page.getByRole('button', { name: 'Sign up and join' }).click();
    await page.waitForURL(new RegExp(`/studio/${studioId}$`));
    await page.getByText('Teacher: Mara Quill').waitFor();
    // the link works once
    expect(
      (await request(server.app).get(`/api/invites/${new URL(inviteLink).searchParams.get('token')}`)).status,
    ).toBe(404);
  });

  it('the teacher sets the saved drill as an assignment; the player sees it on the home page', async () => {
    const { page } = teacherBrowser;
    await page.reload({ waitUntil: 'networkidle' });
    await page.getByTestId('studio-board').getByText('Sam Okafor').waitFor();
    await page.getByLabel('Target tempo (bpm)').fill('100');
    await page.getByLabel('Target accuracy (%)').fill('85');
    await page.getByLabel('Note to the players').fill('Even eighths across the bar line.');
    await page.getByRole('button', { name: 'Set the assignment' }).click();
    await page.getByText('Set: Four-three on D/C, 100 bpm').waitFor();

    const p = playerBrowser.page;
    await p.goto(`${server.url}/home`, { waitUntil: 'networkidle' });
    const item = p.getByTestId('my-assignments').getByRole('listitem').first();
    await item.getByText('Four-three on D/C, 100 bpm').waitFor();
    expect(await item.locator('[data-status]').getAttribute('data-status')).toBe('open');
    const start = item.getByRole('link', { name: 'Start D' });
    const href = (await start.getAttribute('href'))!;
    expect(href).toMatch(/^\/practice\?drill=[\w-]+&assignment=[\w-]+&tempo=100&key=D$/);
  });

  it('the player starts the assignment in one click and plays it on the fake MIDI device, leaving out two notes', async () => {
    const p = playerBrowser.page;
    await p.goto(`${server.url}/home`, { waitUntil: 'networkidle' });
    await p.getByTestId('my-assignments').getByRole('link', { name: 'Start D' }).first().click();
    await p.waitForURL(/\/practice\?drill=/);
    await p.getByTestId('drill-staff').waitFor();
    expect(await p.getByLabel('Tempo (bpm)', { exact: true }).inputValue()).toBe('100');
    await p.getByLabel('Count-in').selectOption('0');
    await p.waitForFunction(() =>
      document.querySelector('[data-testid="input-status"]')?.textContent?.includes('Listening'),
    );
    const drill = inAllKeys({ ...STUDIO_SPEC, tempo: 100 }, 'chromatic').find((d) => drillKey(d.spec) === 'D')!;
    // The first two notes are left out; every other note is played on time.
    const notes = drill.notes.slice(2).map((n) => ({ midi: n.midi, t: (n.beat * 60000) / 100 }));
    await p.getByRole('button', { name: 'Start the take' }).click();
    await p.waitForFunction(() => document.querySelector('[data-testid="practice"]')?.getAttribute('data-origin'));
    const origin = Number(await p.getByTestId('practice').getAttribute('data-origin'));
    await p.evaluate(
      ({ origin, notes }) => {
        for (const n of notes)
          setTimeout(
            () => window.__fakeMidi.noteOn(n.midi, 90, 1, origin + n.t),
            Math.max(0, origin + n.t - performance.now()),
          );
      },
      { origin, notes },
    );
    await p.waitForFunction(
      () => document.querySelector('[data-testid="practice"]')?.getAttribute('data-phase') === 'done',
      null,
      { timeout: 20_000 },
    );
    let rows: Array<{ id: string; assignment_id: string }> = [];
    for (let i = 0; i < 50 && rows.length === 0; i++) {
      rows = (await server.pool.query('SELECT id, assignment_id FROM takes WHERE assignment_id IS NOT NULL')).rows;
      if (rows.length === 0) await new Promise((r) => setTimeout(r, 200));
    }
    expect(rows).toHaveLength(1);
    takeId = rows[0].id;
    expect(playerBrowser.errors).toEqual([]);
  });

  it('the teacher finds the take from the studio table and pins a remark to a missed note', async () => {
    const { page } = teacherBrowser;
    await page.goto(`${server.url}/studio/${studioId}`, { waitUntil: 'networkidle' });
    await page.getByTestId('studio-board').getByRole('link', { name: 'Sam Okafor' }).click();
    await page.waitForURL(/\/players\//);
    await page.getByTestId('player-takes').getByRole('link').first().click();
    await page.waitForURL(new RegExp(`/takes/${takeId}$`));
    await page.locator('[data-testid="drill-staff"]:not([data-version="0"])').waitFor();
    expect(await page.locator('.sf-mark-missed').count()).toBe(2);
    const pin = page.getByLabel('Pin to a note');
    expect(await pin.locator('option:checked').textContent()).toMatch(/^note 1 \(.+\): missed$/);
    await page
      .getByLabel('Remark', { exact: true })
      .fill('Land on the first note: the count-in leads straight into it.');
    await page.getByRole('button', { name: 'Leave the remark' }).click();
    await page.getByTestId('remarks').getByText('Land on the first note').waitFor();
    await page.locator('.sf-pinned').first().waitFor();
    const download = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download MIDI' }).click(),
    ]);
    expect(download[0].suggestedFilename()).toMatch(/\.mid$/);
    expect(teacherBrowser.errors).toEqual([]);
  });

  it('the player is told, reads the remark pinned to the note, and answers', async () => {
    const p = playerBrowser.page;
    await p.goto(`${server.url}/home`, { waitUntil: 'networkidle' });
    await p
      .getByTestId('notifications')
      .getByRole('link', { name: /Mara Quill left a remark/ })
      .click();
    await p.waitForURL(new RegExp(`/takes/${takeId}$`));
    const remark = p.getByTestId('remarks').getByRole('listitem').first();
    await remark.getByText('Land on the first note').waitFor();
    expect(await remark.textContent()).toMatch(/pinned to note 1/);
    await p.locator('.sf-pinned').first().waitFor();
    await remark.getByLabel('Your answer').fill('Thanks, I will count it in out loud.');
    await remark.getByRole('button', { name: 'Send answer' }).click();
    await remark.getByText('Thanks, I will count it in out loud.').waitFor();
    // The invite came first; the remark's e-mail is the newest.
    const mails = await waitForMail(admin, playerEmail, 2);
    expect(mails.at(-1)!.subject).toBe('A remark from Mara Quill on your take');
    expect(mails.at(-1)!.text).toContain('Land on the first note');
    expect(playerBrowser.errors).toEqual([]);
    expect(playerBrowser.foreignRequests).toEqual([]);
  });
});
