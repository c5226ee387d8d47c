import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EngineError, midiToPlayed, pairsForChord } from '../../shared/engine';
import type { DrillSpec } from '../../shared/schemas/drills';
import { violationsInBothThemes } from '../helpers/axe';
import { type BrowserSession, openBrowser, signInThroughPage } from '../helpers/browser';
import { createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { FAKE_KEYBOARD } from '../helpers/practice-page';
import { createSavedDrill, STUDIO_SPEC } from '../helpers/studio-fixtures';
import { startTestServer } from '../helpers/test-server';

/** The message shown under a field (the kit ties it to the input with aria-describedby). */
async function fieldError(field: Locator): Promise<string> {
  expect(await field.getAttribute('aria-invalid')).toBe('true');
  const ids = (await field.getAttribute('aria-describedby')) ?? '';
  const errorId = ids.split(' ').find((id) => id.endsWith('-error'));
  expect(errorId).toBeTruthy();
  return (await field.page().locator(`[id="${errorId}"]`).textContent()) ?? '';
}

async function waitInvalid(field: Locator) {
  await field.page().waitForFunction((el) => el?.getAttribute('aria-invalid') === 'true', await field.elementHandle());
}

/**
 * Every form goes through the one form kit: a value the shared schema (or the server) refuses
 * shows its message on that field and nothing is stored; a good value goes through.
 */
describe('forms refuse bad values on the field, in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let player: TestUser;
  let teacher: TestUser;
  let playerBrowser: BrowserSession;
  let teacherBrowser: BrowserSession;
  let studioId: string;
  let bookId: string;

  beforeAll(async () => {
    server = await startTestServer();
    player = await createUser(server.db, { role: 'player', name: 'Ada Reyes' });
    teacher = await createUser(server.db, { role: 'teacher', name: 'Mara Lind' });
    studioId = (await createStudio(server.db, teacher.id, [player.id])).id;
    await createSavedDrill(server.db, teacher.id);
    const api = await signedIn(server.app, teacher);
    const book = await api.post('/api/books', { title: 'Pairs for the road' }).expect(201);
    bookId = book.body.book.id;
    const saved = await api.get('/api/drills').expect(200);
    await api
      .post(`/api/books/${bookId}/drills`, { savedDrillId: saved.body.drills[0].id, note: 'Slowly first.' })
      .expect(201);
    playerBrowser = await openBrowser(server.url, { fakeMidi: true, midiOptions: FAKE_KEYBOARD });
    await signInThroughPage(playerBrowser.page, server.url, player);
    teacherBrowser = await openBrowser(server.url);
    await signInThroughPage(teacherBrowser.page, server.url, teacher);
  });
  afterAll(async () => {
    await playerBrowser?.close();
    await teacherBrowser?.close();
    await server?.stop();
  });

  async function goto(page: Page, path: string) {
    await page.goto(`${server.url}${path}`, { waitUntil: 'networkidle' });
  }

  it('practice settings: a tempo of 10 is refused on its field; 90 is saved', async () => {
    const { page } = playerBrowser;
    const spec: DrillSpec = { ...STUDIO_SPEC };
    await goto(page, `/practice?spec=${encodeURIComponent(JSON.stringify(spec))}`);
    await page.getByTestId('drill-staff').waitFor();
    await page.getByText('My practice settings').click();
    const form = page.getByRole('form', { name: 'My practice settings' });
    const tempo = form.getByLabel('Default tempo (bpm)');
    await tempo.fill('10');
    await form.getByRole('button', { name: 'Save my settings' }).click();
    await waitInvalid(tempo);
    expect(await fieldError(tempo)).toBe('Tempo runs from 20 to 400');
    const before = await server.pool.query('SELECT default_tempo FROM player_settings WHERE user_id = $1', [player.id]);
    expect(before.rows[0]?.default_tempo ?? null).not.toBe(10);
    await tempo.fill('90');
    await form.getByRole('button', { name: 'Save my settings' }).click();
    await form.getByText('Saved.').waitFor();
    const after = await server.pool.query('SELECT default_tempo FROM player_settings WHERE user_id = $1', [player.id]);
    expect(after.rows[0].default_tempo).toBe(90);
  });

  it('practice settings: a latency measured meanwhile is saved without wiping an unsaved tempo', async () => {
    const { page } = playerBrowser;
    const form = page.getByRole('form', { name: 'My practice settings' });
    const tempo = form.getByLabel('Default tempo (bpm)');
    await tempo.fill('77');
    await page.getByRole('button', { name: 'Measure by tapping' }).click();
    // Tap on every counted click, 15 ms late: 90 bpm, four lead clicks, eight to tap, the first
    // 400 ms after the button (the calibration's own timing).
    await page.evaluate(() => {
      const first = performance.now() + 400;
      const beat = 60000 / 90;
      for (let i = 4; i < 12; i++) {
        const at = first + i * beat + 15;
        setTimeout(() => window.__fakeMidi.noteOn(62, 90, 1, at), Math.max(0, at - performance.now()));
      }
    });
    await page.getByText(/^Measured -?\d+\.\d ms; saved for Fake Keyboard\.$/).waitFor({ timeout: 15_000 });
    // The saved settings are back on the page (the latency line reads them), so the form has had them.
    await page.getByText(/^Fake Keyboard: -?\d+\.\d ms taken off every note\.$/).waitFor();
    const res = await server.pool.query('SELECT default_tempo, latency FROM player_settings WHERE user_id = $1', [
      player.id,
    ]);
    expect(Object.keys(res.rows[0].latency)).toEqual(['Fake Keyboard']);
    expect(res.rows[0].default_tempo).toBe(90);
    expect(await tempo.inputValue()).toBe('77');
  });

  it('loop panel: a measure past the drill is refused and the loop cannot start; a good passage starts it', async () => {
    const { page } = playerBrowser;
    const to = page.getByLabel('To measure');
    await to.fill('99');
    await waitInvalid(to);
    expect(await fieldError(to)).toMatch(/^Choose measures between 1 and \d+, the first no later than the last\.$/);
    expect(await page.getByRole('button', { name: 'Loop these measures' }).isDisabled()).toBe(true);
    await to.fill('1');
    await expect.poll(() => page.getByRole('button', { name: 'Loop these measures' }).isEnabled()).toBe(true);
    await page.getByRole('button', { name: 'Loop these measures' }).click();
    const loop = page.getByTestId('loop');
    await loop.waitFor();
    expect(await loop.getAttribute('data-from')).toBe('1');
    expect(await loop.getAttribute('data-to')).toBe('1');
  });

  it('weekly goal: 5 minutes is refused on the field and not stored', async () => {
    const { page } = playerBrowser;
    await goto(page, '/progress');
    const goal = page.getByLabel('Your weekly goal, in minutes');
    await goal.fill('5');
    await page.getByRole('button', { name: 'Set the goal' }).click();
    await waitInvalid(goal);
    expect(await fieldError(goal)).toBe('Set a weekly goal from 10 to 2000 minutes');
    const res = await server.pool.query('SELECT weekly_minutes_goal FROM player_settings WHERE user_id = $1', [
      player.id,
    ]);
    expect(res.rows[0]?.weekly_minutes_goal ?? null).toBeNull();
  });

  it("import: no file is refused in the browser; a file that is not MIDI shows the server's reason on the file", async () => {
    const { page } = playerBrowser;
    await goto(page, '/history');
    await page.getByText('Import a take recorded elsewhere').click();
    const form = page.getByRole('form', { name: 'Import a MIDI file' });
    const file = form.getByLabel('MIDI file (at most 1 MB)');
    await form.getByRole('button', { name: 'Import and score' }).click();
    await waitInvalid(file);
    expect(await fieldError(file)).toBe('Choose a MIDI file');
    const bytes = Buffer.from('these are not the bytes of a MIDI file');
    let reason = '';
    try {
      midiToPlayed(new Uint8Array(bytes));
    } catch (err) {
      if (err instanceof EngineError) reason = err.message;
    }
    expect(reason).not.toBe('');
    await file.setInputFiles({ name: 'notes.mid', mimeType: 'audio/midi', buffer: bytes });
    await form.getByRole('button', { name: 'Import and score' }).click();
    await page.getByText(reason).waitFor();
    expect(await fieldError(file)).toBe(reason);
    const takes = await server.pool.query('SELECT count(*)::int AS n FROM takes WHERE player_id = $1', [player.id]);
    expect(takes.rows[0].n).toBe(0);
  });

  it('take filters: a date the server refuses shows on that filter', async () => {
    const { page } = playerBrowser;
    await goto(page, '/history?from=2026-02-31x');
    const from = page.getByRole('form', { name: 'Filter takes' }).getByLabel('From');
    await waitInvalid(from);
    expect((await fieldError(from)).length).toBeGreaterThan(0);
  });

  it('book details: a price that is not money is refused on the field; 4,50 is stored as 450 cents', async () => {
    const { page } = teacherBrowser;
    await goto(page, `/books/${bookId}/edit`);
    const form = page.getByRole('form', { name: 'Book details' });
    const price = form.getByLabel('Price');
    await price.fill('lots');
    await form.getByRole('button', { name: 'Save details' }).click();
    await waitInvalid(price);
    expect(await fieldError(price)).toBe('Type a price such as 12.00');
    await price.fill('4,50');
    await form.getByRole('button', { name: 'Save details' }).click();
    await form.getByText('Saved.').waitFor();
    const res = await server.pool.query('SELECT price_minor FROM books WHERE id = $1', [bookId]);
    expect(res.rows[0].price_minor).toBe(450);
  });

  it("book drills: a drill's title left empty is refused on the field and the old title stays", async () => {
    const { page } = teacherBrowser;
    const title = page.getByLabel('Title of drill 1');
    await title.fill('');
    await title.blur();
    await waitInvalid(title);
    expect(await fieldError(title)).toBe('Give the drill a title');
    const res = await server.pool.query('SELECT title FROM book_drills WHERE book_id = $1', [bookId]);
    expect(res.rows[0].title).toBe('Four-three on D/C');
  });

  it('assignment: an accuracy of 2% is refused on the field; nothing is set', async () => {
    const { page } = teacherBrowser;
    await goto(page, `/studio/${studioId}`);
    const form = page.getByRole('form', { name: 'New assignment' });
    const accuracy = form.getByLabel('Target accuracy (%)');
    await accuracy.fill('2');
    await form.getByRole('button', { name: 'Set the assignment' }).click();
    await waitInvalid(accuracy);
    expect(await fieldError(accuracy)).toBe('At least 5%');
    const res = await server.pool.query('SELECT count(*)::int AS n FROM assignments WHERE studio_id = $1', [studioId]);
    expect(res.rows[0].n).toBe(0);
  });

  it("fit finder: a chord the engine cannot read shows the engine's reason on the field", async () => {
    const { page } = teacherBrowser;
    await goto(page, '/drills');
    let reason = '';
    try {
      pairsForChord('H7');
    } catch (err) {
      if (err instanceof EngineError) reason = err.message;
    }
    expect(reason).not.toBe('');
    const chord = page.getByLabel('Chord symbol');
    await chord.fill('H7');
    await page.getByRole('button', { name: 'Find pairs' }).click();
    await waitInvalid(chord);
    expect(await fieldError(chord)).toBe(reason);
    expect(await page.getByTestId('fit').count()).toBe(0);
    await chord.fill('D7');
    await page.getByRole('button', { name: 'Find pairs' }).click();
    await page.getByRole('list', { name: 'Pairs for D7' }).waitFor();
  });

  it('saved drills: a drill without a name is refused on the field', async () => {
    const { page } = teacherBrowser;
    const form = page.getByRole('form', { name: 'Save this drill' });
    await form.getByRole('button', { name: 'Save drill' }).click();
    const name = form.getByLabel('Name for this drill');
    await waitInvalid(name);
    expect((await fieldError(name)).length).toBeGreaterThan(0);
    const res = await server.pool.query('SELECT count(*)::int AS n FROM saved_drills WHERE owner_id = $1', [
      teacher.id,
    ]);
    expect(res.rows[0].n).toBe(1);
  });

  it('drill editor: a tempo of 5 is refused on the tempo field and the last good drill stays shown', async () => {
    const { page } = teacherBrowser;
    const spec: DrillSpec = {
      pair: ['D', 'C'],
      pattern: 'four-three',
      direction: 'up',
      instrument: 'piano',
      tempo: 100,
    };
    await goto(page, `/drills?spec=${encodeURIComponent(JSON.stringify(spec))}`);
    await page.getByTestId('drill-staff').waitFor();
    const title = await page.getByTestId('drill-title').textContent();
    expect(title).toMatch(/^Key 1 of 12: D \/ C/);
    const tempo = page.getByLabel('Tempo (quarter notes per minute)');
    await tempo.fill('5');
    await waitInvalid(tempo);
    expect(await fieldError(tempo)).toBe('The tempo is at least 20');
    // the drill built from the last good values stays on show, and the address keeps it
    expect(await page.getByTestId('drill-title').textContent()).toBe(title);
    expect(await page.getByTestId('drill-staff').count()).toBe(1);
    expect(JSON.parse(new URL(page.url()).searchParams.get('spec') ?? '{}').tempo).toBe(100);
    await tempo.fill('90');
    await page.waitForFunction((el) => el?.getAttribute('aria-invalid') !== 'true', await tempo.elementHandle());
    await expect.poll(() => JSON.parse(new URL(page.url()).searchParams.get('spec') ?? '{}').tempo).toBe(90);
    expect(await page.getByTestId('drill-problem').count()).toBe(0);
  });

  it('the pages with converted forms, errors showing, have no serious accessibility violation (axe-core)', async () => {
    const { page } = teacherBrowser;
    await goto(page, `/books/${bookId}/edit`);
    await page.getByLabel('Price').fill('lots');
    await page.getByRole('button', { name: 'Save details' }).click();
    await waitInvalid(page.getByLabel('Price'));
    expect(await violationsInBothThemes(page)).toEqual({ light: [], dark: [] });
    await goto(page, `/studio/${studioId}`);
    expect(await violationsInBothThemes(page)).toEqual({ light: [], dark: [] });
    const p = playerBrowser.page;
    await goto(p, '/history');
    await p.getByText('Import a take recorded elsewhere').click();
    await p.getByRole('button', { name: 'Import and score' }).click();
    await waitInvalid(p.getByLabel('MIDI file (at most 1 MB)'));
    expect(await violationsInBothThemes(p)).toEqual({ light: [], dark: [] });
    await goto(p, '/progress');
    await p.getByLabel('Your weekly goal, in minutes').fill('5');
    await p.getByRole('button', { name: 'Set the goal' }).click();
    await waitInvalid(p.getByLabel('Your weekly goal, in minutes'));
    expect(await violationsInBothThemes(p)).toEqual({ light: [], dark: [] });
  });
});
