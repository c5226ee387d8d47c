import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { type BrowserContext, chromium, type Page } from 'playwright-core';

export const fakeMidiPath = fileURLToPath(new URL('../e2e/fake-midi.js', import.meta.url));

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  /** console errors and uncaught page errors seen so far */
  errors: string[];
  /** requests that went to any host other than the app's */
  foreignRequests: string[];
  close(): Promise<void>;
}

/**
 * Debian's Chromium driven by playwright-core (never a downloaded browser), with a fresh
 * profile and the flags that keep it off the network.
 */
export async function openBrowser(
  appUrl: string,
  opts: {
    fakeMidi?: boolean;
    midiOptions?: unknown;
    /** a WAV file Chromium plays as its (fake) microphone, once, from when a page opens it; permission granted */
    fakeAudioCapture?: string;
  } = {},
): Promise<BrowserSession> {
  const profile = mkdtempSync(join(tmpdir(), 'sixfold-chromium-'));
  // Chromium's switches for a fake capture device fed from a file, with the permission prompt answered yes.
  const audioArgs = opts.fakeAudioCapture
    ? [
        '--use-fake-device-for-media-stream',
        '--use-fake-ui-for-media-stream',
        `--use-file-for-fake-audio-capture=${opts.fakeAudioCapture}%noloop`,
        '--autoplay-policy=no-user-gesture-required',
      ]
    : [];
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    acceptDownloads: true,
    viewport: { width: 1280, height: 900 },
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      ...audioArgs,
    ],
  });
  if (opts.midiOptions !== undefined) {
    await context.addInitScript((o) => {
      (window as unknown as { __FAKE_MIDI_OPTIONS__: unknown }).__FAKE_MIDI_OPTIONS__ = o;
    }, opts.midiOptions);
  }
  if (opts.fakeMidi) await context.addInitScript({ path: fakeMidiPath });
  const errors: string[] = [];
  const foreignRequests: string[] = [];
  const appOrigin = new URL(appUrl).origin;
  context.on('request', (req) => {
    const url = req.url();
    if (/^(data|blob|about|chrome|chrome-extension):/.test(url)) return;
    if (new URL(url).origin !== appOrigin) foreignRequests.push(url);
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.on('console', (msg) => {
    if (msg.type() === 'error') errors.push(msg.text());
  });
  page.on('pageerror', (err) => errors.push(err.message));
  return {
    context,
    page,
    errors,
    foreignRequests,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Signs in through the sign-in page and waits for the home page. */
export async function signInThroughPage(page: Page, appUrl: string, user: { email: string; password: string }) {
  await page.goto(`${appUrl}/sign-in`, { waitUntil: 'networkidle' });
  await page.getByLabel('E-mail').fill(user.email);
  await page.getByLabel('Password').fill(user.password);
  await page.getByLabel('Password').press('Enter');
  await page.waitForURL(/\/home$/);
}
