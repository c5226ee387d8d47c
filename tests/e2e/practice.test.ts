import { readFileSync } from 'node:fs';
import { parseMidi } from 'midi-file';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill, sliceDrill } from '../../shared/engine';
import { seriousViolations } from '../helpers/axe';
import type { BrowserSession } from '../helpers/browser';
import type { TestUser } from '../helpers/factories';
import { playerWithKeyboard, playFromOrigin, type ScriptNote, startTake, takeDone } from '../helpers/practice-page';
import type { startTestServer } from '../helpers/test-server';

// A short drill at 100 bpm: a beat is 600 ms, so the default hit window is 75 ms and triplet
// notes are 200 ms apart (match window 150 ms). Scripted mistakes sit well inside those.
const SPEC: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up',
  instrument: 'piano',
  tempo: 100,
  range: { low: 60, high: 76 },
};
const msPerBeat = 600;

/** Plays notes on the fake device at their times on the take's clock, each key let go 120 ms later. */
async function play(page: BrowserSession['page'], notes: ScriptNote[]) {
  expect(await playFromOrigin(page, notes, 120)).toBeGreaterThan(0);
}

describe('practice page in Chromium with the fake MIDI device', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let b: BrowserSession;
  let player: TestUser;

  beforeAll(async () => {
    ({ server, player, b } = await playerWithKeyboard('Theo Park'));
  });
  afterAll(async () => {
    await b?.close();
    await server?.stop();
  });

  async function open(spec: DrillSpec) {
    const { page } = b;
    await page.goto(`${server.url}/practice?spec=${encodeURIComponent(JSON.stringify(spec))}&order=chromatic`, {
      waitUntil: 'networkidle',
    });
    await page.getByTestId('drill-staff').waitFor();
    await page.getByLabel('Count-in').selectOption('0');
    await page.waitForFunction(() =>
      document.querySelector('[data-testid="input-status"]')?.textContent?.includes('Listening to Fake Keyboard'),
    );
  }

  it('marks a left-out, a wrong and a late note, stores the take with those verdicts, and exports it', async () => {
    const { page } = b;
    // Long enough (30 notes, about 6 s) that the take is still running when the miss is marked.
    const spec: DrillSpec = { ...SPEC, range: { low: 60, high: 88 } };
    await open(spec);
    expect(await page.getByTestId('caution-start').textContent()).toMatch(/medical professional/);
    const drill = generateDrill(spec);
    const script: ScriptNote[] = [];
    drill.notes.forEach((n, i) => {
      const t = n.beat * msPerBeat;
      if (i === 2) return; // left out
      if (i === 4)
        script.push({ midi: n.midi + 1, t }); // wrong
      else if (i === 6)
        script.push({ midi: n.midi, t: t + 110 }); // late: past the hit window, inside the match window
      else script.push({ midi: n.midi, t });
    });
    await startTake(page);
    await play(page, script);
    // The missed note is marked while the take is still running, as soon as its window closes.
    await page.waitForSelector('[data-note-index="2"].sf-mark-missed', { state: 'attached', timeout: 10_000 });
    expect(await page.getByTestId('practice').getAttribute('data-phase')).toBe('playing');
    await takeDone(page);

    const cls = async (i: number) => (await page.locator(`[data-note-index="${i}"]`).getAttribute('class')) ?? '';
    expect(await cls(0)).toContain('sf-mark-hit');
    expect(await cls(2)).toContain('sf-mark-missed');
    expect(await cls(4)).toContain('sf-mark-wrong');
    expect(await cls(6)).toContain('sf-mark-late');
    expect(await page.getByTestId('slipped').locator('li').count()).toBe(2);

    // The take lands in PostgreSQL once, scored by the server with the same verdicts.
    let rows: Array<{ idx: number; verdict: string }> = [];
    for (let i = 0; i < 50 && rows.length === 0; i++) {
      const res = await server.pool.query(
        `SELECT n.idx, n.verdict FROM take_notes n JOIN takes t ON t.id = n.take_id WHERE t.player_id = $1 ORDER BY n.idx`,
        [player.id],
      );
      rows = res.rows;
      if (rows.length === 0) await new Promise((r) => setTimeout(r, 200));
    }
    expect(rows).toHaveLength(drill.notes.length);
    expect(rows[2].verdict).toBe('missed');
    expect(rows[4].verdict).toBe('wrong');
    expect(rows[6].verdict).toBe('late');
    expect(rows.filter((r) => r.verdict === 'hit')).toHaveLength(drill.notes.length - 3);

    // The download reads back in an independent parser (midi-file) with both tracks.
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download MIDI' }).click(),
    ]);
    const midi = parseMidi(readFileSync(await download.path()));
    const names = midi.tracks
      .map((t) => t.find((e) => e.type === 'trackName'))
      .map((e) => (e && 'text' in e ? e.text : ''));
    expect(names).toEqual(expect.arrayContaining(['Drill', 'Take']));
    const takeOns = midi.tracks[names.indexOf('Take')].filter(
      (e) => e.type === 'noteOn' && 'velocity' in e && e.velocity > 0,
    );
    expect(takeOns).toHaveLength(script.length);
    expect(b.errors).toEqual([]);
  });

  it('suggests 4 bpm more after a clean take', async () => {
    const { page } = b;
    await open(SPEC);
    const drill = generateDrill(SPEC);
    await startTake(page);
    await play(
      page,
      drill.notes.map((n) => ({ midi: n.midi, t: n.beat * msPerBeat })),
    );
    await takeDone(page);
    expect(await page.getByTestId('accuracy').textContent()).toBe('100%');
    // Replayed twice: the second replay stops the first (one at a time), and the page stays whole.
    const replay = page.getByRole('button', { name: 'Replay against the drill' });
    await replay.click();
    await replay.click();
    await page.waitForTimeout(500);
    expect(b.errors).toEqual([]);
    // Common practice for a tempo climb, as the practice issue sets it: clean -> +4 bpm.
    await page.waitForSelector('[data-testid="tempo-climb"][data-tempo="104"]', { timeout: 10_000 });
    await page.getByRole('button', { name: 'Use 104 bpm' }).click();
    expect(await page.getByLabel('Tempo (bpm)', { exact: true }).inputValue()).toBe('104');
  });

  it('climbs the first three ladder steps, fading the notation, each step saved as a take with its measures', async () => {
    const { page } = b;
    const spec: DrillSpec = { ...SPEC, range: { low: 60, high: 84 }, tempo: 160 };
    await open(spec);
    await page.getByLabel('Ladder (memorise measure by measure)').check();
    const full = generateDrill(spec);
    const ms = 60000 / 160;
    const expectedSteps: Array<[number, number]> = [
      [1, 1],
      [2, 2],
      [1, 2],
    ];
    for (const [s, [from, to]] of expectedSteps.entries()) {
      // The page moves on once the last take is scored, a moment after it ends.
      await page.waitForSelector(`[data-testid="ladder-step"][data-step="${s}"]`, { timeout: 10_000 });
      const step = page.getByTestId('ladder-step');
      expect([await step.getAttribute('data-from'), await step.getAttribute('data-to')]).toEqual([
        String(from),
        String(to),
      ]);
      expect(await step.getAttribute('data-fade')).toBe(String(Math.min(2, s)));
      const slice = sliceDrill(full, from, to);
      for (let take = 0; take < 2; take++) {
        await startTake(page);
        await play(
          page,
          slice.notes.map((n) => ({ midi: n.midi, t: n.beat * ms })),
        );
        await takeDone(page);
      }
    }
    await page.waitForSelector('[data-testid="ladder-step"][data-step="3"]', { timeout: 10_000 });
    let measures: Array<{ f: number; t: number }> = [];
    for (let i = 0; i < 50 && measures.length < 6; i++) {
      const res = await server.pool.query(
        'SELECT measure_from AS f, measure_to AS t FROM takes WHERE player_id = $1 AND measure_from IS NOT NULL ORDER BY created_at',
        [player.id],
      );
      measures = res.rows;
      if (measures.length < 6) await new Promise((r) => setTimeout(r, 200));
    }
    expect(measures).toEqual([
      { f: 1, t: 1 },
      { f: 1, t: 1 },
      { f: 2, t: 2 },
      { f: 2, t: 2 },
      { f: 1, t: 2 },
      { f: 1, t: 2 },
    ]);
  });

  it('scores an alto player who plays written pitch on a keyboard', async () => {
    const { page } = b;
    const spec: DrillSpec = { ...SPEC, instrument: 'alto-sax', range: { low: 60, high: 76 } };
    await open(spec);
    await page.getByLabel('My keyboard plays written pitch', { exact: true }).check();
    const drill = generateDrill(spec);
    await startTake(page);
    // From memory: the alto saxophone in Eb sounds a major sixth below written, so written = concert + 9.
    await play(
      page,
      drill.notes.map((n) => ({ midi: n.midi + 9, t: n.beat * msPerBeat })),
    );
    await takeDone(page);
    expect(await page.getByTestId('accuracy').textContent()).toBe('100%');
  });

  it('keeps my practice settings on the server', async () => {
    const { page } = b;
    await open(SPEC);
    await page.getByText('My practice settings').click();
    const form = page.getByRole('form', { name: 'My practice settings' });
    await form.getByLabel(/^Instrument/).selectOption('alto-sax');
    await form.getByLabel('Default tempo (bpm)').fill('88');
    await form.getByLabel(/written pitch/).check();
    await form.getByRole('button', { name: 'Save my settings' }).click();
    await form.getByText('Saved.').waitFor();
    const res = await server.pool.query(
      'SELECT instrument, default_tempo, written_pitch_input FROM player_settings WHERE user_id = $1',
      [player.id],
    );
    expect(res.rows[0]).toEqual({ instrument: 'alto-sax', default_tempo: 88, written_pitch_input: true });
  });

  it('has no serious accessibility violation (axe-core)', async () => {
    const { page } = b;
    await open(SPEC);
    expect(await seriousViolations(page)).toEqual([]);
  });
});
