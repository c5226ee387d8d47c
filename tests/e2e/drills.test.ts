import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { XMLParser } from 'fast-xml-parser';
import { parseMidi } from 'midi-file';
import { Note } from 'tonal';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateDrill, inAllKeys } from '../../shared/engine';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import { createStudio, createUser, type TestUser } from '../helpers/factories';
import { startTestServer } from '../helpers/test-server';

const artifacts = fileURLToPath(new URL('../.artifacts/', import.meta.url));

/** The drill the page should show after picking D/C from the fit finder for D7 (alto sax, defaults). */
const EXPECTED_SPEC = {
  pair: ['C', 'D'] as [string, string],
  pattern: 'four-three' as const,
  direction: 'up' as const,
  instrument: 'alto-sax' as const,
  tempo: 100,
  meter: [4, 4] as [number, number],
  chord: 'D7',
};

describe('the drills page in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;
  let alto: TestUser;

  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    server = await startTestServer();
    const teacher = await createUser(server.db, { role: 'teacher', name: 'Mara Quill' });
    alto = await createUser(server.db, { role: 'player', name: 'Ines Duarte' });
    await createStudio(server.db, teacher.id, [alto.id], 'Harbour Lane Music Collective');
    browser = await openBrowser(server.url);
    const { page } = browser;
    await page.goto(`${server.url}/sign-in?next=%2Fdrills`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail').fill(alto.email);
    await page.getByLabel('Password').fill(alto.password);
    await page.getByLabel('Password').press('Enter');
    await page.waitForURL((url) => url.pathname !== '/sign-in');
    await page.goto(`${server.url}/drills`, { waitUntil: 'networkidle' });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('finds pairs for D7 and draws the chosen one in written pitch for alto sax', async () => {
    const { page } = browser;
    await page.getByLabel('Instrument').selectOption('alto-sax');
    await page.getByLabel('Chord symbol').fill('D7');
    await page.getByRole('button', { name: 'Find pairs' }).click();
    const fits = page.getByTestId('fit');
    await fits.first().waitFor();
    // Each note's function is shown: C/D over D7 holds b7, 1, 9, 3, #11... as the engine names them.
    expect(await fits.first().textContent()).toMatch(/b7/);
    await page.getByRole('button', { name: 'Use C / D' }).click();

    const expected = generateDrill(EXPECTED_SPEC);
    const staff = page.getByTestId('drill-staff');
    await page.waitForFunction(
      (n) => document.querySelectorAll('[data-testid="drill-staff"] [data-note-index]').length === n,
      expected.notes.length,
    );
    expect(await staff.locator('[data-note-index]').count()).toBe(expected.notes.length);
    expect(await page.getByTestId('drill-title').textContent()).toMatch(/C \/ D \(written A \/ B\)/);
    // Written pitch: alto sax reads a major sixth above concert, and each drawn note is the written one.
    const written = await staff
      .locator('[data-note-index]')
      .evaluateAll((els) => els.map((el) => el.getAttribute('data-written')));
    expect(written).toEqual(expected.notes.map((n) => n.written));
    expect(expected.notes.every((n) => Note.midi(n.written) === n.midi + 9)).toBe(true);
    // The clef is drawn, and the staff's measures are numbered.
    expect(await staff.locator('.sf-clef').count()).toBeGreaterThan(0);
    // The two triads are told apart: both kinds of note are drawn, each with its class.
    expect(await staff.locator('.sf-triad-a').count()).toBeGreaterThan(0);
    expect(await staff.locator('.sf-triad-b').count()).toBeGreaterThan(0);
    // Measure numbers, and a range diagram marking the drill's notes.
    expect(await staff.locator('svg').count()).toBe(1);
    const marked = await page
      .locator('svg[aria-label^="Range"] rect.fill-dusk-500, svg[aria-label^="Range"] rect.fill-brass-500')
      .count();
    expect(marked).toBe(new Set(expected.notes.map((n) => n.midi)).size);
    await page.screenshot({ path: join(artifacts, 'drills-page.png'), fullPage: true });
    expect(browser.errors).toEqual([]);
  });

  it('flips through all 12 keys of the cycle', async () => {
    const { page } = browser;
    const cycle = inAllKeys(EXPECTED_SPEC, 'chromatic');
    const keys = page.getByRole('navigation', { name: 'Key cycle' }).getByRole('listitem');
    expect(await keys.count()).toBe(12);
    await page.getByRole('button', { name: 'Next key' }).click();
    await page.waitForFunction(
      (n) => document.querySelectorAll('[data-testid="drill-staff"] [data-note-index]').length === n,
      cycle[1].notes.length,
    );
    expect(await page.getByTestId('drill-title').textContent()).toMatch(/^Key 2 of 12: Db \/ Eb/);
    await page.getByRole('button', { name: 'Previous key' }).click();
    expect(await page.getByTestId('drill-title').textContent()).toMatch(/^Key 1 of 12/);
  });

  it('says what is wrong with a bad chord or a pair that shares a note, never a blank page', async () => {
    const { page } = browser;
    await page.getByLabel('Chord symbol').fill('H7');
    await page.getByRole('button', { name: 'Find pairs' }).click();
    // The chord is checked by a schema loaded on first use: the alert comes a moment after the click.
    await page.getByRole('alert').filter({ hasText: 'not a chord symbol' }).waitFor();
    expect(await page.getByRole('alert').filter({ hasText: 'not a chord symbol' }).count()).toBe(1);
    await page.getByRole('textbox', { name: 'Triad b' }).fill('Am');
    expect(await page.getByTestId('pair-error').textContent()).toMatch(/share/i);
    expect(await page.getByTestId('drill-problem').count()).toBe(1);
    await page.getByRole('textbox', { name: 'Triad b' }).fill('D');
    await page.getByTestId('drill-staff').waitFor();
    expect(await page.getByTestId('drill-problem').count()).toBe(0);
  });

  it('downloads the drill as MIDI and MusicXML that read back', async () => {
    const { page } = browser;
    const expected = generateDrill(EXPECTED_SPEC);
    const [midiDl] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'MIDI file' }).click(),
    ]);
    expect(midiDl.suggestedFilename()).toBe('sixfold-c-d-four-three-c.mid');
    const midi = parseMidi(readFileSync((await midiDl.path())!));
    const onsets = midi.tracks.flatMap((t) =>
      t.filter((e) => e.type === 'noteOn' && e.velocity > 0).map((e) => (e.type === 'noteOn' ? e.noteNumber : -1)),
    );
    expect(onsets).toEqual(expected.notes.map((n) => n.midi));

    const [xmlDl] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'MusicXML file' }).click(),
    ]);
    expect(xmlDl.suggestedFilename()).toBe('sixfold-c-d-four-three-c.musicxml');
    const xml = new XMLParser({ ignoreAttributes: false }).parse(readFileSync((await xmlDl.path())!, 'utf8'));
    type XmlNote = { pitch?: { step: string } };
    const measures = [xml['score-partwise'].part.measure].flat() as Array<{ note: XmlNote | XmlNote[] }>;
    const pitched = measures.flatMap((m) => [m.note].flat()).filter((n): n is Required<XmlNote> => Boolean(n?.pitch));
    expect(pitched).toHaveLength(expected.notes.length);
    expect(pitched.map((n) => n.pitch.step)).toEqual(expected.notes.map((n) => n.written[0]));
  });

  it('renders the preview offline (no sound device) with an onset at each expected time', async () => {
    const { page } = browser;
    await page.getByLabel('Click').uncheck();
    await page.getByLabel(/Chord pad/).uncheck();
    const failed = page
      .getByRole('alert')
      .filter({ hasText: 'audio file could not' })
      .waitFor({ timeout: 60_000 })
      .then(async () => {
        throw new Error(`render failed in the page: ${browser.errors.join(' | ')}`);
      });
    const [wavDl] = await Promise.all([
      Promise.race([page.waitForEvent('download', { timeout: 60_000 }), failed]),
      page.getByRole('button', { name: 'Audio (WAV)' }).click(),
    ]);
    failed.catch(() => {});
    const bytes = readFileSync((await wavDl.path())!);
    const rate = bytes.readUInt32LE(24);
    const pcm = bytes.subarray(44);
    const samples = new Int16Array(pcm.length / 2);
    for (let i = 0; i < samples.length; i++) samples[i] = pcm.readInt16LE(i * 2);
    const expected = generateDrill(EXPECTED_SPEC);
    // With the click off, the count-in still clicks one measure: 4 beats at 100, then the notes.
    const beat = 60 / 100;
    const wanted = [0, 1, 2, 3].map((b) => b * beat).concat(expected.notes.map((n) => 4 * beat + n.beat * beat));
    const found = onsets(samples, rate);
    expect(found.length).toBe(wanted.length);
    wanted.forEach((t, i) => {
      expect(Math.abs(found[i] - t), `onset ${i} at ${t.toFixed(3)} s, found ${found[i].toFixed(3)} s`).toBeLessThan(
        0.01,
      );
    });
  }, 90_000);

  it('saves the drill and lists it', async () => {
    const { page } = browser;
    await page.getByLabel('Name for this drill').fill('D7 pair for Tuesday');
    await page.getByRole('button', { name: 'Save drill' }).click();
    await page.getByText('Saved “D7 pair for Tuesday”.').waitFor();
    await page.getByTestId('saved-drill').filter({ hasText: 'D7 pair for Tuesday' }).waitFor();
    const res = await page.request.get(`${server.url}/api/drills`);
    const body = (await res.json()) as { drills: Array<{ name: string; spec: { pair: string[] } }> };
    expect(body.drills.find((d) => d.name === 'D7 pair for Tuesday')?.spec.pair).toEqual(['C', 'D']);
  });

  it.each([
    {
      pair: ['Bbm', 'Ab'],
      pattern: 'scale-steps',
      direction: 'up-down',
      instrument: 'trombone',
      meter: [3, 4],
      tempo: 80,
    },
    {
      pair: ['G', 'Db'],
      pattern: 'weave',
      direction: 'down',
      instrument: 'guitar',
      // Triplets cannot fill 7/8 (the engine refuses it); in 6/8 they are written as plain eighths.
      meter: [6, 8],
      tempo: 132,
      chord: 'G7',
    },
    {
      pair: ['A', 'G'],
      pattern: 'leap-back',
      direction: 'up',
      instrument: 'tenor-sax',
      meter: [6, 8],
      tempo: 90,
      chord: 'Em7',
    },
    {
      pair: ['C', 'D'],
      pattern: 'stack',
      direction: 'up',
      instrument: 'trumpet',
      meter: [5, 4],
      tempo: 200,
      chord: 'Cmaj7#11',
    },
    {
      pair: ['D', 'C'],
      pattern: { name: 'Sixteenth climb', subdivision: 'sixteenth', source: 'scale', degrees: [0, 2, 1, 3], step: 1 },
      direction: 'up',
      instrument: 'flute',
      meter: [4, 4],
      tempo: 60,
    },
  ])('draws $pattern $direction for $instrument in $meter, every note, from the address alone', async (spec) => {
    const { page } = browser;
    const expected = generateDrill(spec as Parameters<typeof generateDrill>[0]);
    await page.goto(`${server.url}/drills?spec=${encodeURIComponent(JSON.stringify(spec))}`, {
      waitUntil: 'networkidle',
    });
    await page.waitForFunction(
      (n) => document.querySelectorAll('[data-testid="drill-staff"] [data-note-index]').length === n,
      expected.notes.length,
    );
    const written = await page
      .locator('[data-testid="drill-staff"] [data-note-index]')
      .evaluateAll((els) => els.map((el) => el.getAttribute('data-written')));
    expect(written).toEqual(expected.notes.map((n) => n.written));
    expect(browser.errors).toEqual([]);
  });

  it('says why weave cannot be written in 7/8 (the message names both) and draws no staff', async () => {
    const { page } = browser;
    const spec = { pair: ['G', 'Db'], pattern: 'weave', direction: 'down', instrument: 'guitar', meter: [7, 8] };
    await page.goto(`${server.url}/drills?spec=${encodeURIComponent(JSON.stringify(spec))}`, {
      waitUntil: 'networkidle',
    });
    const problem = page.getByTestId('drill-problem');
    await problem.waitFor();
    const text = (await problem.textContent()) ?? '';
    expect(text).toMatch(/Weave/);
    expect(text).toMatch(/triplets/);
    expect(text).toMatch(/7\/8/);
    expect(await page.getByTestId('drill-staff').count()).toBe(0);
    // Choosing a meter triplets fill draws the drill.
    await page.getByLabel('Meter').selectOption('6/8');
    await page.getByTestId('drill-staff').waitFor();
    expect(await problem.count()).toBe(0);
    expect(browser.errors).toEqual([]);
  });

  it('prints the key cycle: 12 staves in written pitch, then a PDF', async () => {
    const { page } = browser;
    await page.goto(`${server.url}/drills?spec=${encodeURIComponent(JSON.stringify(EXPECTED_SPEC))}&order=chromatic`, {
      waitUntil: 'networkidle',
    });
    await page.getByRole('link', { name: /Printable key cycle/ }).click();
    await page.waitForURL(/\/drills\/print\?/);
    await page.getByText('All 12 keys are drawn.').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('print-key').count()).toBe(12);
    const cycle = inAllKeys(EXPECTED_SPEC, 'chromatic');
    const counts = await page
      .getByTestId('print-key')
      .evaluateAll((els) => els.map((el) => el.querySelectorAll('[data-note-index]').length));
    expect(counts).toEqual(cycle.map((d) => d.notes.length));
    expect(await page.locator('progress').getAttribute('value')).toBe('12');
    await page.emulateMedia({ media: 'print' });
    const pdf = await page.pdf({ format: 'A4' });
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdf.length).toBeGreaterThan(20_000);
    await page.emulateMedia({ media: 'screen' });
    await page.screenshot({ path: join(artifacts, 'drills-print.png'), fullPage: true });
    expect(browser.errors).toEqual([]);
    expect(browser.foreignRequests).toEqual([]);
  });
});

/** Times (s) where the signal rises out of silence: each drill note's attack. */
function onsets(samples: Int16Array, rate: number): number[] {
  const hop = Math.round(rate * 0.002);
  const out: number[] = [];
  let quiet = true;
  for (let i = 0; i + hop <= samples.length; i += hop) {
    let peak = 0;
    for (let j = i; j < i + hop; j++) peak = Math.max(peak, Math.abs(samples[j]));
    if (quiet && peak > 600) {
      // Find the first sample over the threshold inside this window.
      let k = i;
      while (k < i + hop && Math.abs(samples[k]) <= 600) k++;
      out.push(k / rate);
      quiet = false;
    } else if (!quiet && peak < 120) {
      quiet = true;
    }
  }
  return out;
}
