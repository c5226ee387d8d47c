import type { Page } from 'playwright-core';
import { openBrowser, signInThroughPage } from './browser';
import { createUser } from './factories';
import { startTestServer } from './test-server';

/** One MIDI keyboard on the fake device, as the practice browser tests plug it in. */
export const FAKE_KEYBOARD = { inputs: [{ id: 'kb', name: 'Fake Keyboard', manufacturer: 'Test' }], outputs: [] };

/** A test server and a player signed in through the page in Chromium, with the fake keyboard. */
export async function playerWithKeyboard(name: string) {
  const server = await startTestServer();
  const player = await createUser(server.db, { role: 'player', name });
  const b = await openBrowser(server.url, { fakeMidi: true, midiOptions: FAKE_KEYBOARD });
  await signInThroughPage(b.page, server.url, player);
  return { server, player, b };
}

/** A note to play, `t` ms after the take's first downbeat. */
export interface ScriptNote {
  midi: number;
  t: number;
}

/**
 * Plays notes on the fake device at their time from the take's first downbeat (the page's
 * data-origin), stamped with those times; `releaseMs` also lets each key go that much later.
 */
export async function playFromOrigin(page: Page, notes: ScriptNote[], releaseMs?: number): Promise<number> {
  const origin = Number(await page.getByTestId('practice').getAttribute('data-origin'));
  await page.evaluate(
    ({ origin, notes, releaseMs }) => {
      for (const n of notes) {
        const at = origin + n.t;
        setTimeout(
          () => {
            window.__fakeMidi.noteOn(n.midi, 90, 1, at);
            if (releaseMs !== undefined)
              setTimeout(() => window.__fakeMidi.noteOff(n.midi, 0, 1, at + releaseMs), releaseMs);
          },
          Math.max(0, at - performance.now()),
        );
      }
    },
    { origin, notes, releaseMs },
  );
  return origin;
}

/** Starts a take and waits for its first downbeat's time to be on the page. */
export async function startTake(page: Page) {
  await page.getByRole('button', { name: /Start (the|another) take/ }).click();
  await page.waitForFunction(() => document.querySelector('[data-testid="practice"]')?.getAttribute('data-origin'));
}

/** Waits until the take is over and scored on the page. */
export async function takeDone(page: Page, timeout = 20_000) {
  await page.waitForFunction(
    () => document.querySelector('[data-testid="practice"]')?.getAttribute('data-phase') === 'done',
    null,
    { timeout },
  );
}
