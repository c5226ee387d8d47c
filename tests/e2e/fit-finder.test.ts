import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pairsForChord } from '../../shared/engine';
import { type BrowserSession, openBrowser, signInThroughPage } from '../helpers/browser';
import { createUser } from '../helpers/factories';
import { startTestServer } from '../helpers/test-server';

const artifacts = fileURLToPath(new URL('../.artifacts/', import.meta.url));

describe('the fit finder in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;

  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    server = await startTestServer();
    const player = await createUser(server.db, { role: 'player', name: 'Theo Park' });
    browser = await openBrowser(server.url);
    await signInThroughPage(browser.page, server.url, player);
    await browser.page.goto(`${server.url}/drills`, { waitUntil: 'networkidle' });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  async function ask(chord: string) {
    const { page } = browser;
    await page.getByLabel('Chord symbol').fill(chord);
    await page.getByRole('button', { name: 'Find pairs' }).click();
    await page.getByRole('list', { name: `Pairs for ${chord}` }).waitFor();
  }

  it('marks the altered pairs of D7 and hides them on request', async () => {
    const { page } = browser;
    await ask('D7');
    const engine = pairsForChord('D7');
    const altered = engine.filter((f) => f.altered);
    expect(altered.length).toBeGreaterThan(0);
    const fits = page.getByTestId('fit');
    // best first: C/D heads the list, its notes grouped as chord tones and tensions in D7's spelling
    expect(await fits.first().getByRole('button', { name: 'Use C / D' }).count()).toBe(1);
    const first = fits.first().getByTestId('fit-notes');
    expect(await first.locator('[data-role="chord-tone"]').textContent()).toBe('Chord tonesD 1F# 3A 5C b7');
    expect(await first.locator('[data-role="tension"]').textContent()).toBe('TensionsE 9G 11');

    await page.getByRole('button', { name: `Show all ${engine.length}` }).click();
    expect(await fits.count()).toBe(engine.length);
    const abBb = fits.filter({ has: page.getByRole('button', { name: 'Use Ab / Bb' }) });
    expect(await abBb.getByTestId('altered-mark').textContent()).toBe('leaves out the 5th');
    expect(await page.getByTestId('altered-mark').count()).toBe(altered.length);

    await page.getByLabel(/Show altered pairs/).uncheck();
    expect(await page.getByTestId('altered-mark').count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Use Ab / Bb' }).count()).toBe(0);
    expect(await page.getByRole('status').textContent()).toContain(`(${altered.length} altered hidden)`);
    await page.getByLabel(/Show altered pairs/).check();
    await page.getByRole('button', { name: `Show all ${engine.length}` }).click();
    expect(await page.getByRole('button', { name: 'Use Ab / Bb' }).count()).toBe(1);
    expect(browser.errors).toEqual([]);
  });

  it("names G7alt's classic pair Db / Eb first, its notes as the chord spells them", async () => {
    const { page } = browser;
    await ask('G7alt');
    const first = page.getByTestId('fit').first();
    expect(await first.getByRole('button', { name: 'Use Db / Eb' }).count()).toBe(1);
    // tonal spells G7alt G B D# F A#: the third is B, never Cb
    expect(await first.locator('[data-role="chord-tone"]').textContent()).toBe('Chord tonesG 1D# #5F b7');
    expect(await first.locator('[data-role="tension"]').textContent()).toBe('TensionsAb b9A# #9C# #11');
  });

  it("plays the pair's scale over the chord with one click, loading the sound engine only then", async () => {
    const { page } = browser;
    await ask('C7#9b13');
    const scripts = () =>
      page.evaluate(() =>
        performance
          .getEntriesByType('resource')
          .map((e) => e.name)
          .filter((n) => n.endsWith('.js')),
      );
    const before = await scripts();
    expect(before.some((n) => n.includes('/player-'))).toBe(false);
    const first = page.getByTestId('fit').first();
    expect(await first.getByRole('button', { name: 'Use Gb / Ab' }).count()).toBe(1);
    expect(await first.getByTestId('altered-mark').count()).toBe(1);
    await first.getByRole('button', { name: 'Hear the scale of Gb / Ab over C7#9b13' }).click();
    await first.getByRole('button', { name: 'Stop the scale of Gb / Ab over C7#9b13' }).waitFor();
    const after = await scripts();
    expect(after.some((n) => n.includes('/player-'))).toBe(true);
    expect(after.length).toBeGreaterThan(before.length + 1);
    await page.screenshot({ path: join(artifacts, 'fit-finder.png'), fullPage: false });
    // the scale runs its course (13 notes) and the button comes back
    await first.getByRole('button', { name: 'Hear the scale of Gb / Ab over C7#9b13' }).waitFor({ timeout: 15000 });
    expect(await page.getByRole('alert').count()).toBe(0);
    expect(browser.errors).toEqual([]);
  });
});
