import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import { createUser, type TestUser } from '../helpers/factories';
import { startTestServer } from '../helpers/test-server';

const shots = process.env.SHOTS_DIR ?? fileURLToPath(new URL('../.artifacts/', import.meta.url));

describe('the progression editor on the drills page, in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;
  let player: TestUser;

  beforeAll(async () => {
    mkdirSync(shots, { recursive: true });
    server = await startTestServer();
    player = await createUser(server.db, { role: 'player', name: 'Theo Park' });
    browser = await openBrowser(server.url);
    const { page } = browser;
    await page.goto(`${server.url}/sign-in?next=%2Fdrills`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail').fill(player.email);
    await page.getByLabel('Password').fill(player.password);
    await page.getByLabel('Password').press('Enter');
    await page.waitForURL((url) => url.pathname !== '/sign-in');
    await page.goto(`${server.url}/drills`, { waitUntil: 'networkidle' });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('plays the drill through a starting progression, a pair for each chord', async () => {
    const { page } = browser;
    const toggle = page.getByLabel('Play the pattern through a progression, a pair for each chord');
    const pairFields = page.getByRole('textbox', { name: /^Triad [ab]$/ });
    const padChord = page.getByRole('textbox', { name: 'Chord (for the pad)' });
    expect(await pairFields.count()).toBe(2);
    await toggle.check();
    // the progression sets the pairs and the pad: the single pair and the pad's chord stand aside
    await page.getByTestId('progression-sets-pair').waitFor();
    expect(await pairFields.count()).toBe(0);
    expect(await padChord.count()).toBe(0);
    await toggle.uncheck();
    await expect.poll(() => pairFields.count()).toBe(2);
    expect(await padChord.count()).toBe(1);
    expect(await page.getByTestId('progression-sets-pair').count()).toBe(0);
    await toggle.check();
    await page.getByLabel('Start from').selectOption('blues');
    const chords = page.getByTestId('progression-chord');
    // F7 Bb7 F7 (two bars) Bb7 (two bars) F7 D7 Gm7 C7 F7 C7: a chord held over a bar line is one change
    await expect.poll(() => chords.count()).toBe(10);
    expect(await chords.first().textContent()).toMatch(/F7, 4 beats/);
    expect(await chords.nth(2).textContent()).toMatch(/F7, 8 beats/);
    await expect.poll(() => page.getByTestId('drill-title').textContent()).toMatch(/Key 1 of 12: F7 Bb7/);
    // the address carries the progression, so the drill can be reloaded and practised
    const spec = JSON.parse(new URL(page.url()).searchParams.get('spec') ?? '{}');
    expect(spec.changes).toHaveLength(10);
    expect(spec.pair).toBeUndefined();
    await page.screenshot({ path: `${shots}/progression-blues.png`, fullPage: true });
  });

  it('reads typed bars, splitting a bar between two chords, and names a bad symbol', async () => {
    const { page } = browser;
    const chart = page.getByTestId('progression-chart');
    await chart.fill('| Dm7 G7 | Cmaj7 |');
    const chords = page.getByTestId('progression-chord');
    await expect.poll(() => chords.count()).toBe(3);
    expect(await chords.nth(0).textContent()).toMatch(/Dm7, 2 beats/);
    expect(await chords.nth(1).textContent()).toMatch(/G7, 2 beats/);
    expect(await chords.nth(2).textContent()).toMatch(/Cmaj7, 4 beats/);
    await chart.fill('| Dm7 G7 | Cxq7 |');
    const error = page.getByTestId('progression-error');
    await error.waitFor();
    expect(await error.textContent()).toMatch(/Bar 2.*Cxq7/);
    // the last good progression stays in place
    expect(await chords.count()).toBe(3);
  });

  it('pins another of a chord’s fits, and the drill keeps it', async () => {
    const { page } = browser;
    await page.getByTestId('progression-chart').fill('| Dm7 G7 | Cmaj7 |');
    const g7 = page.getByTestId('progression-chord').nth(1).getByRole('combobox');
    // the second of G7's fits, whichever the fit finder ranks there
    const label = (await g7.locator('option').nth(2).textContent()) ?? '';
    const pair = label.replace('Pinned: ', '').split(' / ');
    await g7.selectOption({ index: 2 });
    await expect
      .poll(() => JSON.parse(new URL(page.url()).searchParams.get('spec') ?? '{}').changes?.[1]?.pair)
      .toEqual(pair);
    expect(await g7.inputValue()).toBe(pair.join('|'));
    await page.getByLabel('Choruses').fill('2');
    await expect.poll(() => page.getByTestId('drill-title').textContent()).toMatch(/2 choruses/);
    expect(browser.errors).toEqual([]);
    await page.screenshot({ path: `${shots}/progression-pinned.png`, fullPage: true });
  });

  it('saves the progression drill and opens it again, bars and pins and all', async () => {
    const { page } = browser;
    const pinned = JSON.parse(new URL(page.url()).searchParams.get('spec') ?? '{}').changes;
    await page.getByLabel('Name for this drill').fill('ii-V-I, pinned V');
    await page.getByRole('button', { name: 'Save drill' }).click();
    await page.getByRole('button', { name: 'Open ii-V-I, pinned V' }).waitFor();
    // somewhere else, then back to the saved one
    await page.getByLabel('Start from').selectOption('minor-blues');
    await expect.poll(() => page.getByTestId('progression-chord').count()).toBe(7);
    await page.getByRole('button', { name: 'Open ii-V-I, pinned V' }).click();
    await expect.poll(() => page.getByTestId('progression-chart').inputValue()).toBe('| Dm7 G7 | Cmaj7 |');
    await expect.poll(() => JSON.parse(new URL(page.url()).searchParams.get('spec') ?? '{}').changes).toEqual(pinned);
  });

  it('opens the progression drill on the practice page, named by its chords', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'Practise this drill' }).click();
    await page.waitForURL((url) => url.pathname === '/practice');
    const name = page.getByTestId('progression-name');
    await name.waitFor();
    expect(await name.textContent()).toMatch(/over Dm7 G7 Cmaj7/);
    expect(JSON.parse(new URL(page.url()).searchParams.get('spec') ?? '{}').choruses).toBe(2);
    expect(browser.errors).toEqual([]);
    await page.screenshot({ path: `${shots}/progression-practice.png`, fullPage: true });
  });
});
