import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drillToMidi, generateDrill } from '../../shared/engine';
import type { DrillSpec } from '../../shared/schemas/drills';
import { seriousViolations, violationsInBothThemes } from '../helpers/axe';
import { type BrowserSession, openBrowser, signInThroughPage } from '../helpers/browser';
import { createUser, signedIn, type TestUser, uniqueEmail, waitForMail } from '../helpers/factories';
import { startTestServer } from '../helpers/test-server';

const artifacts = fileURLToPath(new URL('../.artifacts/', import.meta.url));

/**
 * The account pages a newcomer meets first, in Chromium: sign-up, password reset by e-mail,
 * account settings, and a take imported from a MIDI file; each checked with axe-core in both
 * themes.
 */
describe('sign-up, password reset, account settings and MIDI import in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;
  let admin: TestUser;
  const email = uniqueEmail('newcomer');

  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    server = await startTestServer();
    admin = await createUser(server.db, { role: 'admin' });
    browser = await openBrowser(server.url);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('a newcomer signs up as a player and lands on the home page', { timeout: 90_000 }, async () => {
    const { page } = browser;
    await page.goto(`${server.url}/sign-up`, { waitUntil: 'networkidle' });
    expect(await violationsInBothThemes(page)).toEqual({ light: [], dark: [] });
    await page.getByRole('button', { name: 'Create account' }).click();
    // Nothing filled in: each field says what it needs, nothing is sent.
    await page.locator('input[type="email"][aria-invalid="true"]').waitFor();
    await page.getByLabel('Your name').fill('Noor Haddad');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('a quiet fifth');
    await page.getByRole('radio').first().check();
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.waitForURL(/\/home$/);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toMatch(/Noor/);
    expect(browser.errors).toEqual([]);
  });

  it('changes the name and the password on the account page', { timeout: 90_000 }, async () => {
    const { page } = browser;
    await page.goto(`${server.url}/account`, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { name: 'Account settings' }).waitFor();
    expect(await violationsInBothThemes(page)).toEqual({ light: [], dark: [] });
    const nameForm = page.getByRole('form', { name: 'Your name' });
    await nameForm.getByLabel('Name').fill('Noor H.');
    await nameForm.getByRole('button', { name: 'Save name' }).click();
    await nameForm.getByText(/saved/i).waitFor();
    const pw = page.getByRole('form', { name: 'Change password' });
    await pw.getByLabel('Current password').fill('a quiet fifth');
    await pw.getByLabel('New password').fill('a louder fourth');
    await pw.getByRole('button', { name: 'Change password' }).click();
    await pw.getByText(/changed/i).waitFor();
    await page.screenshot({ path: join(artifacts, 'account.png'), fullPage: true });
    expect(browser.errors).toEqual([]);
  });

  it('imports a take from a MIDI file and opens it scored', { timeout: 90_000 }, async () => {
    const { page } = browser;
    const spec: DrillSpec = { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100 };
    const midi = drillToMidi(generateDrill(spec));
    await page.goto(`${server.url}/history`, { waitUntil: 'networkidle' });
    await page.getByText('Import a take recorded elsewhere').click();
    const form = page.getByRole('form', { name: 'Import a MIDI file' });
    await form.getByLabel('MIDI file (at most 1 MB)').setInputFiles({
      name: 'four-three.mid',
      mimeType: 'audio/midi',
      buffer: Buffer.from(midi),
    });
    expect(await seriousViolations(page)).toEqual([]);
    await form.getByRole('button', { name: 'Import and score' }).click();
    await page.waitForURL(/\/history\/[0-9a-f-]+$/);
    // The drill's own file played back note for note: every note a hit (Standard MIDI Files 1.0).
    await page
      .getByText(/100\s?%/)
      .first()
      .waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    expect(browser.errors).toEqual([]);
  });

  it('a signed-out player resets the password through the e-mailed link', { timeout: 90_000 }, async () => {
    const fresh = await openBrowser(server.url);
    try {
      const { page } = fresh;
      await page.goto(`${server.url}/forgot-password`, { waitUntil: 'networkidle' });
      expect(await violationsInBothThemes(page)).toEqual({ light: [], dark: [] });
      await page.getByLabel('E-mail').fill(email);
      await page.getByRole('button', { name: 'Send me a link' }).click();
      await page.getByText(`If an account uses ${email}`).waitFor({ timeout: 15_000 });
      const adminClient = await signedIn(server.app, admin);
      const [mail] = await waitForMail(adminClient, email);
      expect(mail.subject).toMatch(/password/i);
      const token = /reset-password\?token=([^\s"&<]+)/.exec(mail.text)?.[1];
      expect(token, mail.text).toBeTruthy();
      await page.goto(`${server.url}/reset-password?token=${token}`, { waitUntil: 'networkidle' });
      expect(await seriousViolations(page)).toEqual([]);
      await page.getByLabel('New password', { exact: true }).fill('the third time');
      await page.getByRole('button', { name: 'Set new password' }).click();
      await page.getByText('Your new password is set').waitFor({ timeout: 15_000 });
      await signInThroughPage(page, server.url, { email, password: 'the third time' });
      // The link works once.
      await page.goto(`${server.url}/reset-password?token=${token}`, { waitUntil: 'networkidle' });
      expect(fresh.errors.filter((e) => !/status of 4\d\d/.test(e))).toEqual([]);
    } finally {
      await fresh.close();
    }
  });
});
