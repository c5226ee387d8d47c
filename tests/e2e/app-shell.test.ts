import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import { startTestServer } from '../helpers/test-server';

describe('app shell in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;

  beforeAll(async () => {
    server = await startTestServer();
    browser = await openBrowser(server.url);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('loads with no console error and no request to another host', async () => {
    const { page } = browser;
    await page.goto(server.url, { waitUntil: 'networkidle' });
    expect(await page.title()).toBe('Sixfold');
    expect(await page.locator('h1').textContent()).toMatch(/every key/i);
    // The shipped Manrope font is the one in use (no font from a CDN).
    const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
    expect(family).toMatch(/Manrope/);
    expect(await page.evaluate(() => document.fonts.check('16px Manrope'))).toBe(true);
    expect(browser.errors).toEqual([]);
    expect(browser.foreignRequests).toEqual([]);
  });

  it('shows a page for unknown routes', async () => {
    const { page } = browser;
    await page.goto(`${server.url}/no/such/page`, { waitUntil: 'networkidle' });
    expect(await page.getByText('Page not found').count()).toBe(1);
    expect(browser.errors).toEqual([]);
  });

  it('switches to the dark theme and remembers it', async () => {
    const { page } = browser;
    await page.goto(server.url, { waitUntil: 'networkidle' });
    await page.getByRole('button', { name: /dark theme/i }).click();
    await page.reload({ waitUntil: 'networkidle' });
    expect(await page.evaluate(() => document.documentElement.classList.contains('dark'))).toBe(true);
  });

  it('fits a phone-sized screen without sideways scrolling', async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 375, height: 740 });
    await page.goto(server.url, { waitUntil: 'networkidle' });
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.setViewportSize({ width: 1280, height: 900 });
  });
});
