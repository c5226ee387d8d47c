import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seriousViolations, violationsInBothThemes } from '../helpers/axe';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import { startTestServer } from '../helpers/test-server';

const artifacts = fileURLToPath(new URL('../.artifacts/', import.meta.url));
const PHONE = { width: 390, height: 844 };

async function logRows(page: BrowserSession['page']) {
  return page.$$eval('[data-testid="note-log"] tbody tr', (rows) =>
    rows.map((r) => ({
      midi: Number(r.getAttribute('data-midi')),
      type: r.getAttribute('data-type'),
      time: Number(r.getAttribute('data-time')),
      source: r.getAttribute('data-source'),
    })),
  );
}

describe('note input in Chromium with the fake MIDI device', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server?.stop();
  });

  it('delivers notes with their own timestamps, ignores pedal and breath, and follows hot-plug', async () => {
    const b = await openBrowser(server.url, {
      fakeMidi: true,
      midiOptions: { inputs: [{ id: 'in-1', name: 'Fake Keyboard', manufacturer: 'Test' }], outputs: [] },
    });
    try {
      const { page } = b;
      await page.goto(`${server.url}/input`, { waitUntil: 'networkidle' });
      await page.waitForFunction(() =>
        document.querySelector('[data-testid="input-status"]')?.textContent?.includes('Listening to Fake Keyboard'),
      );

      // The event's own timestamp travels through, not the moment the handler ran.
      await page.evaluate(() => {
        __fakeMidi.noteOn(60, 100, 1, 1234.5);
        // MIDI 1.0: note-on with velocity 0 is a note-off.
        __fakeMidi.send([0x90, 60, 0], 1400.25);
        // MIDI 1.0: CC 64 (sustain) and CC 2 (breath) are never notes.
        __fakeMidi.send([0xb0, 64, 127], 1500);
        __fakeMidi.send([0xb0, 2, 80], 1510);
        __fakeMidi.noteOn(67, 90, 1, 1600);
      });
      await page.waitForFunction(() => document.querySelectorAll('[data-testid="note-log"] tbody tr').length >= 3);
      const rows = (await logRows(page)).reverse();
      expect(rows).toEqual([
        { midi: 60, type: 'on', time: 1234.5, source: 'midi' },
        { midi: 60, type: 'off', time: 1400.25, source: 'midi' },
        { midi: 67, type: 'on', time: 1600, source: 'midi' },
      ]);

      // Hot-plug: a second device appears in the list; unplugging the chosen one is said plainly.
      await page.evaluate(() => __fakeMidi.addInput({ id: 'in-2', name: 'Second Keys', manufacturer: 'Test' }));
      await page.waitForSelector('option:has-text("Second Keys")', { state: 'attached' });
      await page.evaluate(() => __fakeMidi.removeInput('in-1'));
      await page.waitForFunction(() =>
        document.querySelector('[data-testid="input-status"]')?.textContent?.includes('disconnected'),
      );
      expect(await page.locator('option:has-text("Fake Keyboard")').count()).toBe(0);
      expect(b.errors).toEqual([]);
    } finally {
      await b.close();
    }
  });

  for (const [reject, state, words] of [
    ['NotAllowedError', 'denied', /refused/],
    ['InvalidStateError', 'unavailable', /no working MIDI system/],
  ] as const) {
    it(`says why when MIDI is refused (${reject}) and falls back to the computer keyboard`, async () => {
      const b = await openBrowser(server.url, { fakeMidi: true, midiOptions: { inputs: [], outputs: [], reject } });
      try {
        const { page } = b;
        await page.goto(`${server.url}/input`, { waitUntil: 'networkidle' });
        const status = page.getByTestId('input-status');
        await page.waitForFunction(
          (s) => document.querySelector('[data-testid="input-status"]')?.getAttribute('data-state') === s,
          state,
        );
        expect(await status.textContent()).toMatch(words);
        await page.keyboard.down('a');
        await page.keyboard.up('a');
        await page.waitForFunction(() => document.querySelectorAll('[data-testid="note-log"] tbody tr').length >= 2);
        const rows = (await logRows(page)).reverse();
        // Octave 4 by default: A is C4 = 60 (MIDI 1.0: middle C is 60).
        expect(rows.map((r) => [r.midi, r.type, r.source])).toEqual([
          [60, 'on', 'keys'],
          [60, 'off', 'keys'],
        ]);
        expect(rows[0].time).toBeGreaterThan(0);
      } finally {
        await b.close();
      }
    });
  }

  it('names the on-screen keys, plays them, passes axe in both themes and never scrolls sideways on a phone', async () => {
    mkdirSync(artifacts, { recursive: true });
    const b = await openBrowser(server.url, {
      fakeMidi: true,
      midiOptions: { inputs: [{ id: 'in-1', name: 'Fake Keyboard', manufacturer: 'Test' }], outputs: [] },
    });
    const overflow = () => b.page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    const listening = () =>
      b.page.waitForFunction(() =>
        document.querySelector('[data-testid="input-status"]')?.textContent?.includes('Listening to Fake Keyboard'),
      );
    try {
      const { page } = b;
      await page.goto(`${server.url}/input`, { waitUntil: 'networkidle' });
      await listening();
      expect(await violationsInBothThemes(page)).toEqual({ light: [], dark: [] });

      // Every key of C3 to C6 is a button named as the app spells keys (flats for Db Eb Ab Bb, F#).
      const keys = page.getByRole('group', { name: 'On-screen keyboard, C3 to C6' }).getByRole('button');
      expect(await keys.count()).toBe(37);
      for (const name of ['C3', 'Db4', 'Eb4', 'F#4', 'Ab4', 'Bb4', 'C6']) {
        expect(await page.getByRole('button', { name, exact: true }).count()).toBe(1);
      }
      // A key sounds while pressed and says so; letting go ends the note.
      const c4 = page.getByRole('button', { name: 'C4', exact: true });
      const box = await c4.boundingBox();
      if (!box) throw new Error('C4 is not drawn');
      await page.mouse.move(box.x + box.width / 2, box.y + box.height - 10);
      await page.mouse.down();
      await page.getByRole('button', { name: 'C4: held', exact: true }).waitFor();
      expect(await seriousViolations(page)).toEqual([]);
      await page.mouse.up();
      await c4.waitFor();
      await page.waitForFunction(() => document.querySelectorAll('[data-testid="note-log"] tbody tr').length >= 2);
      expect((await logRows(page)).reverse().map((r) => [r.midi, r.type, r.source])).toEqual([
        [60, 'on', 'screen'],
        [60, 'off', 'screen'],
      ]);

      // A phone, 390 px wide, with the note log empty: the keyboard scrolls inside its frame,
      // opened near middle C, and the page itself does not scroll sideways.
      await page.setViewportSize(PHONE);
      await page.reload({ waitUntil: 'networkidle' });
      await listening();
      expect(await page.getByText('Nothing yet.').isVisible()).toBe(true);
      expect(await overflow()).toBeLessThanOrEqual(0);
      const frame = page.getByRole('region', { name: /On-screen keyboard, C3 to C6/ });
      const scroll = await frame.evaluate((el) => ({
        width: el.scrollWidth,
        client: el.clientWidth,
        left: el.scrollLeft,
      }));
      expect(scroll.width).toBeGreaterThan(scroll.client);
      expect(scroll.left).toBeGreaterThan(0);
      const frameBox = await frame.boundingBox();
      const c4Box = await c4.boundingBox();
      if (!frameBox || !c4Box) throw new Error('the keyboard is not drawn');
      expect(c4Box.x).toBeGreaterThanOrEqual(frameBox.x);
      expect(c4Box.x + c4Box.width).toBeLessThanOrEqual(frameBox.x + frameBox.width);
      expect(await violationsInBothThemes(page)).toEqual({ light: [], dark: [] });
      await listening();
      await page.screenshot({ path: join(artifacts, 'input-check-phone.png'), fullPage: true });

      // With the note log full, still nothing wider than the screen.
      await page.evaluate(() => {
        for (let i = 0; i < 12; i++) __fakeMidi.noteOn(48 + i * 3, 100, 1, 2000 + i * 125.25);
      });
      await page.waitForFunction(() => document.querySelectorAll('[data-testid="note-log"] tbody tr').length >= 12);
      expect(await overflow()).toBeLessThanOrEqual(0);
      expect(await seriousViolations(page)).toEqual([]);
      await page.screenshot({ path: join(artifacts, 'input-check-phone-log.png'), fullPage: true });
      expect(b.errors).toEqual([]);
    } finally {
      await b.close();
    }
  }, 120_000);
});
