import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import { createStudio, createUser, type TestUser } from '../helpers/factories';
import { startTestServer } from '../helpers/test-server';

describe('signing in through the page in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;
  let player: TestUser;

  beforeAll(async () => {
    server = await startTestServer();
    const teacher = await createUser(server.db, { role: 'teacher', name: 'Mara Quill' });
    player = await createUser(server.db, { role: 'player', name: 'Theo Park' });
    await createStudio(server.db, teacher.id, [player.id], 'Harbour Lane Music Collective');
    browser = await openBrowser(server.url);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('sends a signed-out visitor from a guarded page to sign-in', async () => {
    const { page } = browser;
    await page.goto(`${server.url}/home`, { waitUntil: 'networkidle' });
    await page.waitForURL(/\/sign-in\?next=%2Fhome$/);
    expect(await page.getByRole('heading', { name: 'Sign in to Sixfold' }).count()).toBe(1);
  });

  it('paints the form before its form kit arrives, then takes input once it has', async () => {
    const { page } = browser;
    // Hold back the form's own chunk: the page must already show the form's outline.
    let release: () => void = () => {};
    const held = new Promise<void>((r) => {
      release = r;
    });
    await page.route(/\/assets\/sign-in-form-[^/]+\.js$/, async (route) => {
      await held;
      await route.continue();
    });
    await page.goto(`${server.url}/sign-in`);
    await page.getByRole('heading', { name: 'Sign in to Sixfold' }).waitFor();
    expect(await page.getByLabel('E-mail').isDisabled()).toBe(true);
    expect(await page.getByRole('button', { name: 'Sign in' }).isDisabled()).toBe(true);
    release();
    await page.locator('form[aria-label="Sign in"]').waitFor();
    expect(await page.getByLabel('E-mail').isEditable()).toBe(true);
    await page.unroute(/\/assets\/sign-in-form-[^/]+\.js$/);
  });

  it('shows field errors inline before sending anything', async () => {
    const { page } = browser;
    await page.getByLabel('E-mail').fill('not-an-address');
    await page.getByRole('button', { name: 'Sign in' }).click();
    const email = page.getByLabel('E-mail');
    // The form's schema loads on the first check, so the marks come a moment later.
    await page.locator('input[type="email"][aria-invalid="true"]').waitFor();
    expect(await email.getAttribute('aria-invalid')).toBe('true');
    const describedBy = (await email.getAttribute('aria-describedby'))!;
    expect(await page.locator(`[id="${describedBy}"]`).textContent()).toMatch(/e-mail address/i);
    expect(await page.getByLabel('Password').getAttribute('aria-invalid')).toBe('true');
  });

  it('signs in with the keyboard and lands on the player home page', async () => {
    const { page } = browser;
    await page.getByLabel('E-mail').fill(player.email);
    await page.getByLabel('Password').fill(player.password);
    await page.getByLabel('Password').press('Enter');
    await page.waitForURL(/\/home$/);
    await page.getByTestId('home-player').waitFor();
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toMatch(/Theo/);
    expect(await page.getByRole('link', { name: /Find a pair/ }).getAttribute('href')).toBe('/drills');
    await page.getByText('Harbour Lane Music Collective').waitFor();
    expect(await page.getByTestId('signed-in-name').textContent()).toBe('Theo Park');
    const nav = page.getByRole('navigation', { name: 'Main' });
    expect(await nav.getByRole('link').allTextContents()).toEqual([
      'Home',
      'Drills',
      'Practice',
      'History',
      'Progress',
      'Books',
    ]);
    // A player's nav has no admin pages; an admin page says it is not for this role.
    await page.goto(`${server.url}/admin/users`, { waitUntil: 'networkidle' });
    expect(await page.getByText('Not for your role').count()).toBe(1);
    expect(browser.errors).toEqual([]);
    expect(browser.foreignRequests).toEqual([]);
  });

  it('signs out, and the guarded page asks for sign-in again', async () => {
    const { page } = browser;
    await page.goto(`${server.url}/home`, { waitUntil: 'networkidle' });
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(`${server.url}/home`, { waitUntil: 'networkidle' });
    await page.waitForURL(/\/sign-in\?next=/);
    expect(browser.errors).toEqual([]);
  });

  it('goes on to the page that asked for the sign-in', async () => {
    const { page } = browser;
    await page.goto(`${server.url}/history`, { waitUntil: 'networkidle' });
    await page.waitForURL(/\/sign-in\?next=%2Fhistory$/);
    await page.getByLabel('E-mail').fill(player.email);
    await page.getByLabel('Password').fill(player.password);
    await page.getByLabel('Password').press('Enter');
    await page.waitForURL(/\/history$/);
    expect(browser.errors).toEqual([]);
  });
});
