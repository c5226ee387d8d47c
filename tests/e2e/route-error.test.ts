import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import { startTestServer } from '../helpers/test-server';

describe('a page whose code fails to load, in Chromium', () => {
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

  it('reloads once by itself, then says so in plain words with a reload and a way home', async () => {
    const { page } = browser;
    // The books page's chunk is gone, as after a deploy that renamed it.
    let aborted = 0;
    await page.route(/\/assets\/books-[^/]+\.js$/, (route) => {
      aborted += 1;
      return route.abort();
    });
    let loads = 0;
    page.on('load', () => {
      loads += 1;
    });
    await page.goto(`${server.url}/books`);
    const alert = page.getByRole('alert').filter({ hasText: 'updated while this page was open' });
    await alert.waitFor();
    // The first failure reloaded the page once; the second shows the message, with no loop.
    expect(loads).toBe(2);
    expect(aborted).toBeGreaterThanOrEqual(2);
    expect(await page.getByRole('button', { name: 'Reload' }).count()).toBe(1);
    expect(await page.getByRole('link', { name: 'Go home' }).getAttribute('href')).toBe('/');
    // The navigation of the app shell stays around the message.
    expect(await page.getByRole('navigation').count()).toBeGreaterThan(0);
  });
});
