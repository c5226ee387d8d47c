import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill } from '../../shared/engine';
import { renderPhrase, type SynthNote, toWav } from '../../scripts/audio/horn-synth';
import { type BrowserSession, openBrowser, signInThroughPage } from '../helpers/browser';
import { createUser, type TestUser } from '../helpers/factories';
import { startTestServer } from '../helpers/test-server';

// A slow drill (30 bpm: triplet notes 667 ms apart, about 6 s in all) scored in free mode, so
// the recording only has to play its notes in order while the take runs, whenever the fake
// microphone starts.
const SPEC: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up',
  instrument: 'piano',
  tempo: 30,
  range: { low: 60, high: 72 },
};
const drill = generateDrill(SPEC);

/** The drill's notes played on a horn-like tone after a second of room noise, tongued, 300 ms apart. */
function recording(): Uint8Array {
  const notes: SynthNote[] = drill.notes.map((n, i) => ({
    midi: n.midi,
    startMs: 1000 + i * 300,
    durationMs: 240,
    db: -18,
    vibrato: i % 3 === 2 ? { hz: 5.5, cents: 30 } : undefined,
    bend: i % 4 === 1 ? { cents: -60, ms: 40 } : undefined,
  }));
  const samples = renderPhrase({ name: 'e2e', description: '', sampleRate: 48000, notes, noiseDb: -62, seed: 9 });
  return toWav(samples, 48000);
}

describe('practice page listening through the microphone (Chromium fake capture from a WAV file)', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let b: BrowserSession;
  let player: TestUser;
  let dir: string;

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'sixfold-mic-'));
    const wav = join(dir, 'line.wav');
    writeFileSync(wav, recording());
    server = await startTestServer();
    player = await createUser(server.db, { role: 'player', name: 'Ada Horn' });
    b = await openBrowser(server.url, { fakeAudioCapture: wav });
    await signInThroughPage(b.page, server.url, player);
  });
  afterAll(async () => {
    await b?.close();
    await server?.stop();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  async function open() {
    const { page } = b;
    await page.goto(`${server.url}/practice?spec=${encodeURIComponent(JSON.stringify(SPEC))}&order=chromatic`, {
      waitUntil: 'networkidle',
    });
    await page.getByTestId('drill-staff').waitFor();
    await page.getByLabel('Count-in').selectOption('0');
    await page.getByLabel('Scoring').selectOption('free');
  }

  it('says in plain words when the microphone is refused or missing, and keeps the keyboards', async () => {
    const { page } = b;
    await open();
    for (const [name, words] of [
      ['NotAllowedError', /microphone was refused/],
      ['NotFoundError', /No microphone was found/],
    ] as const) {
      await page.evaluate((n) => {
        navigator.mediaDevices.getUserMedia = () => Promise.reject(new DOMException('refused in the test', n));
      }, name);
      await page.getByLabel('Play with').selectOption('microphone');
      const status = page.getByTestId('input-status');
      await page.waitForFunction(() =>
        /mic-(denied|no-device)/.test(
          document.querySelector('[data-testid="input-status"]')?.getAttribute('data-state') ?? '',
        ),
      );
      expect(await status.textContent()).toMatch(words);
      expect(await status.textContent()).toMatch(/on-screen or computer keyboard/);
      // Back to the keyboards: the picker does not stay on a microphone that is not there.
      expect(await page.getByLabel('Play with').inputValue()).toBe('');
      await page.getByLabel('Play with').selectOption('');
    }
    // The computer keyboard still plays into a take.
    await page.getByRole('button', { name: 'Start the take' }).click();
    await page.keyboard.down('KeyA');
    await page.keyboard.up('KeyA');
    await page.getByRole('button', { name: /Stop/ }).click();
    expect(b.errors).toEqual([]);
  });

  it('hears the recording, marks every note of the take and stores it as a microphone take', async () => {
    const { page } = b;
    await open();
    await page.getByRole('button', { name: 'Start the take' }).click();
    await page.waitForFunction(() => document.querySelector('[data-testid="practice"]')?.getAttribute('data-origin'));
    // Picking the microphone starts the capture, and with it the recording.
    await page.getByLabel('Play with').selectOption('microphone');
    await page.waitForFunction(
      () => document.querySelector('[data-testid="input-status"]')?.getAttribute('data-state') === 'mic-listening',
    );
    expect(await page.getByTestId('input-status').textContent()).toMatch(/Listening through the microphone/);
    expect(await page.getByTestId('mic-headphones').textContent()).toMatch(/headphones/);
    // The tapping calibration measures and stores the microphone's latency as its own input.
    await page.getByText('Microphone: not measured yet').waitFor();
    // The level meter moves once the notes come.
    await page.waitForFunction(
      () => ((document.querySelector('[data-testid="mic-level"]') as HTMLMeterElement | null)?.value ?? -80) > -40,
      null,
      { timeout: 10_000 },
    );

    const last = drill.notes.length - 1;
    await page.waitForSelector(`[data-note-index="${last}"].sf-mark-hit`, { state: 'attached', timeout: 15_000 });
    await page.waitForFunction(
      () => document.querySelector('[data-testid="practice"]')?.getAttribute('data-phase') === 'done',
      null,
      { timeout: 15_000 },
    );
    for (let i = 0; i <= last; i++) {
      expect(await page.locator(`[data-note-index="${i}"]`).getAttribute('class')).toContain('sf-mark-hit');
    }
    expect(await page.getByTestId('accuracy').textContent()).toBe('100%');

    // Stored once, scored by the server, with what it was played on.
    let rows: Array<{ input_kind: string; accuracy: number; played: Array<{ midi: number; velocity: number }> }> = [];
    for (let i = 0; i < 50 && rows.length === 0; i++) {
      const res = await server.pool.query(
        `SELECT input_kind, accuracy, played FROM takes WHERE player_id = $1 AND jsonb_array_length(played) > 1`,
        [player.id],
      );
      rows = res.rows;
      if (rows.length === 0) await new Promise((r) => setTimeout(r, 200));
    }
    expect(rows).toHaveLength(1);
    expect(rows[0].input_kind).toBe('microphone');
    expect(rows[0].accuracy).toBe(1);
    expect(rows[0].played.map((n) => n.midi)).toEqual(drill.notes.map((n) => n.midi));
    for (const n of rows[0].played) expect(n.velocity).toBeGreaterThan(0);

    // The next visit listens again at once: the player chose the microphone and the browser allows it.
    await open();
    await page.waitForFunction(
      () => document.querySelector('[data-testid="input-status"]')?.getAttribute('data-state') === 'mic-listening',
    );
    expect(await page.getByLabel('Play with').inputValue()).toBe('microphone');
    // Choosing the keyboards lets the microphone go, and the visit after that does not ask for it.
    await page.getByLabel('Play with').selectOption('');
    await open();
    await page.waitForTimeout(500);
    expect(await page.getByTestId('input-status').getAttribute('data-state')).not.toMatch(/^mic-/);
    expect(b.errors).toEqual([]);
  });
});
