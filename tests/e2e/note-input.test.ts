import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import { startTestServer } from '../helpers/test-server';

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
});
