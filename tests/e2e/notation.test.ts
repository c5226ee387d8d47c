import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { type DrillSpec, generateDrill, notate, type PlayedNote, type Verdict } from '../../shared/engine';
import { seriousViolations } from '../helpers/axe';
import { type BrowserSession, openBrowser, signInThroughPage } from '../helpers/browser';
import { createUser, signedIn, type TestUser } from '../helpers/factories';
import { startTestServer } from '../helpers/test-server';

/** Screenshots for a person to look at (not compared by the test). */
const shots = process.env.SHOTS_DIR ?? join(process.cwd(), 'tests', '.artifacts', 'notation');

const ALTO: DrillSpec = {
  pair: ['C', 'D'],
  pattern: 'four-three',
  direction: 'up',
  instrument: 'alto-sax',
  chord: 'D7',
};
const PIANO: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up-down',
  instrument: 'piano',
  range: { low: 43, high: 79 },
};
/** High on a wind controller: the top of it sits under an 8va line. */
const HIGH_WIND: DrillSpec = {
  pair: ['E', 'D'],
  pattern: 'weave',
  direction: 'up',
  instrument: 'wind-controller',
  range: { low: 67, high: 96 },
};

/** Piano up to C8: B7 and C8 sit under a 15ma line, the rest of the high passage under 8va. */
const PIANO_TO_C8: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up-down',
  instrument: 'piano',
  range: { low: 84, high: 108 },
};

const drillsUrl = (base: string, spec: DrillSpec) =>
  `${base}/drills?${new URLSearchParams({ spec: JSON.stringify(spec), order: 'chromatic' }).toString()}`;

describe('the staff drawn from the notation model, in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let b: BrowserSession;
  let player: TestUser;

  beforeAll(async () => {
    mkdirSync(shots, { recursive: true });
    server = await startTestServer();
    player = await createUser(server.db, { role: 'player', name: 'Ruth Okafor' });
    b = await openBrowser(server.url);
    await signInThroughPage(b.page, server.url, player);
  });
  afterAll(async () => {
    await b?.close();
    await server?.stop();
  });

  async function openDrill(spec: DrillSpec) {
    const { page } = b;
    await page.goto(drillsUrl(server.url, spec), { waitUntil: 'networkidle' });
    const drill = generateDrill(spec);
    await page.waitForFunction(
      (n) => document.querySelectorAll('[data-testid="drill-staff"] [data-index]').length === n,
      drill.notes.length,
    );
    return drill;
  }

  it('gives every drawn note its index, an empty verdict and settled=false', async () => {
    const drill = await openDrill(ALTO);
    const staff = b.page.getByTestId('drill-staff');
    const attrs = await staff
      .locator('[data-index]')
      .evaluateAll((els) =>
        els.map((el) => [
          Number(el.getAttribute('data-index')),
          el.getAttribute('data-verdict'),
          el.getAttribute('data-settled'),
        ]),
      );
    expect(attrs.map((a) => a[0]).sort((x, y) => Number(x) - Number(y))).toEqual(drill.notes.map((_n, i) => i));
    expect(attrs.every((a) => a[1] === '' && a[2] === 'false')).toBe(true);
    // What is printed is what the model says: the same count of accidentals, one per sign.
    const printed = notate(drill).measures.flatMap((m) => m.events.filter((e) => e.accidental)).length;
    expect(await staff.locator('.sf-accidental').count()).toBe(printed);
    // The a/b tags sit in their own lane over the cells (one per cell, two where a line breaks
    // inside it), not as text under notes.
    const tagged = await staff.locator('.sf-cell').evaluateAll((els) => els.map((el) => el.getAttribute('data-cell')));
    expect(new Set(tagged).size).toBe(new Set(drill.notes.map((n) => n.cell)).size);
    expect(await staff.locator('.sf-stavenote text:not(.sf-notehead, .sf-accidental, .sf-flag, .sf-dot)').count()).toBe(
      0,
    );
    for (const [w, name] of [
      [1280, 'desktop'],
      [390, 'phone'],
    ] as const) {
      await b.page.setViewportSize({ width: w, height: 900 });
      await b.page.waitForTimeout(300);
      await b.page.screenshot({ path: join(shots, `drills-alto-${name}.png`), fullPage: true });
    }
    await b.page.setViewportSize({ width: 1280, height: 900 });
    expect(b.errors).toEqual([]);
  });

  it('draws piano on a grand staff: a brace, a treble and a bass staff', async () => {
    const drill = await openDrill(PIANO);
    const staff = b.page.getByTestId('drill-staff');
    expect(await staff.getAttribute('data-staves')).toBe('treble bass');
    // Two clefs at the start of every line, and the brace joining them.
    expect(await staff.locator('.sf-clef').count()).toBeGreaterThanOrEqual(2);
    expect(await staff.locator('.sf-brace').count()).toBeGreaterThan(0);
    // Notes below middle C sit on the bass staff (common practice for piano).
    const notation = notate(drill);
    const onBass = notation.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note' && e.staff === 1));
    expect(onBass.length).toBeGreaterThan(0);
    await b.page.screenshot({ path: join(shots, 'drills-piano-desktop.png'), fullPage: true });
  });

  it('puts the top of a high wind-controller drill under an 8va line', async () => {
    const drill = await openDrill(HIGH_WIND);
    const notation = notate(drill);
    const under = notation.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note' && e.ottava === 8));
    expect(under.length).toBeGreaterThan(0);
    const staff = b.page.getByTestId('drill-staff');
    expect(await staff.locator('[data-ottava="8va"]').count()).toBeGreaterThan(0);
    expect(await staff.locator('.sf-ottava-text').first().textContent()).toBe('8va');
    await b.page.screenshot({ path: join(shots, 'drills-wind-8va-desktop.png'), fullPage: true });
  });

  it('puts B7 and C8 under a 15ma line, their noteheads two octaves below the written pitch', async () => {
    const drill = await openDrill(PIANO_TO_C8);
    const events = notate(drill).measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    const staff = b.page.getByTestId('drill-staff');
    expect(await staff.locator('[data-ottava="15ma"]').count()).toBeGreaterThan(0);
    expect(await staff.locator('[data-ottava="8va"]').count()).toBeGreaterThan(0);
    const labels = await staff.locator('.sf-ottava-text').allTextContents();
    expect(labels).toContain('15ma');
    // each drawn notehead's centre, by note index
    const centre = async (i: number) =>
      staff
        .locator(`[data-index="${i}"] .sf-notehead`)
        .first()
        .evaluate((el) => {
          const r = el.getBoundingClientRect();
          return r.top + r.height / 2;
        });
    // C8 under 15ma and C7 under 8va both print as C6 (common practice), so on one line of
    // music their noteheads sit at one height; an A7 under 15ma sits an octave lower on the
    // page than an A7 under 8va
    const c8 = events.find((e) => e.written === 'C8' && e.ottava === 15)!;
    const c7 = events.find((e) => e.written === 'C7' && e.ottava === 8 && e.noteIndex! > c8.noteIndex!)!;
    expect(c8 && c7).toBeTruthy();
    expect(Math.abs((await centre(c8.noteIndex!)) - (await centre(c7.noteIndex!)))).toBeLessThan(1);
    const a7Two = events.find((e) => e.written === 'A7' && e.ottava === 15)!;
    const a7One = events.find((e) => e.written === 'A7' && e.ottava === 8 && e.noteIndex! > a7Two.noteIndex!)!;
    // an octave is seven staff steps, three and a half line spaces (the staff draws a space 10 units high)
    const scale = await staff
      .locator('.sf-stave')
      .first()
      .evaluate((el) => {
        const svg = el.closest('svg')!;
        return svg.getBoundingClientRect().width / svg.viewBox.baseVal.width;
      });
    const drop = (await centre(a7Two.noteIndex!)) - (await centre(a7One.noteIndex!));
    expect(drop / scale).toBeCloseTo(35, 0);
    await b.page.screenshot({ path: join(shots, 'drills-piano-15ma-desktop.png'), fullPage: true });
    expect(b.errors).toEqual([]);
  });

  it('writes the chord symbols of a drill over changes above the staff', async () => {
    const spec = {
      changes: [
        { chord: 'Dm7', beats: 4 },
        { chord: 'G7', beats: 4 },
        { chord: 'Cmaj7', beats: 8 },
      ],
      pattern: 'four-three',
      direction: 'up',
      instrument: 'alto-sax',
    } as DrillSpec;
    const drill = await openDrill(spec);
    const starts = notate(drill).measures.flatMap((m) => (m.chords ?? []).map((c) => c.chord));
    const drawn = await b.page.locator('[data-testid="drill-staff"] .sf-chord').allTextContents();
    // Each chord where it starts; one held into a new line may be shown again at that line's start.
    expect(drawn.slice(0, starts.length)).toEqual(starts);
  });

  it('says beside the staff when the range leaves a drill shorter than two bars', async () => {
    // Stacking E/D from G4 on a wind controller reaches its top in one bar.
    const short: DrillSpec = { ...HIGH_WIND, pattern: 'stack' };
    expect(generateDrill(short).measures).toBeLessThan(2);
    await openDrill(short);
    expect(await b.page.getByTestId('short-drill').textContent()).toMatch(/Only one bar/);
    await openDrill(HIGH_WIND);
    expect(await b.page.getByTestId('short-drill').count()).toBe(0);
  });

  it("takes the range as note names in the player's written pitch, with concert beside", async () => {
    const { page } = b;
    await openDrill(ALTO);
    const low = page.getByTestId('range-low');
    await low.fill('H3');
    expect(await page.getByText('“H3” is not a note name').count()).toBe(1);
    await low.fill('Bb');
    expect(await page.getByText('needs an octave number').count()).toBe(1);
    // Alto saxophone sounds a major sixth below written (common practice): written C#4 is concert E3, MIDI 52.
    await low.fill('C#4');
    await page.getByText('Sounds E3 concert (MIDI 52)').waitFor();
    await page.waitForFunction(() => new URL(location.href).searchParams.get('spec')?.includes('"low":52'));
  });

  it('marks a stored take with a shape per verdict, readable in both themes', async () => {
    const { page } = b;
    // At 100 bpm the hit window is 75 ms and the match window 150 ms (the scorer's defaults).
    const spec: DrillSpec = { ...ALTO, tempo: 100, range: { low: 52, high: 72 } };
    const drill = generateDrill(spec);
    const plan: Verdict[] = ['hit', 'early', 'late', 'wrong', 'missed'];
    const played: PlayedNote[] = [];
    drill.notes.forEach((n, i) => {
      const t = n.beat * 600;
      const want = plan[i % plan.length];
      if (want === 'missed') return;
      const offset = want === 'early' ? -115 : want === 'late' ? 115 : 0;
      played.push({ midi: want === 'wrong' ? n.midi + 1 : n.midi, timeMs: t + offset, velocity: 80 });
    });
    const api = await signedIn(server.app, player);
    const res = await api.post('/api/takes', {
      id: randomUUID(),
      spec,
      played,
      options: { tempo: 100, mode: 'timed' },
      startedAt: new Date().toISOString(),
    });
    expect(res.status).toBe(201);
    const take = res.body.take as { id: string };
    const stored = (await api.get(`/api/takes/${take.id}`)).body.take as {
      score: { results: Array<{ verdict: Verdict }> };
    };
    await page.goto(`${server.url}/takes/${take.id}`, { waitUntil: 'networkidle' });
    await page.waitForFunction(
      (n) =>
        document.querySelectorAll('[data-testid="drill-staff"] [data-verdict]:not([data-verdict=""])').length === n,
      drill.notes.length,
    );
    const drawn = await page
      .locator('[data-testid="drill-staff"] [data-index]')
      .evaluateAll((els) =>
        els
          .map(
            (el) =>
              [
                Number(el.getAttribute('data-index')),
                el.getAttribute('data-verdict'),
                el.getAttribute('data-settled'),
              ] as const,
          )
          .sort((x, y) => x[0] - y[0]),
      );
    expect(drawn.map((d) => d[1])).toEqual(stored.score.results.map((r) => r.verdict));
    expect(drawn.every((d) => d[2] === 'true')).toBe(true);
    // Every verdict the take holds is drawn by its own shape under the note.
    const verdicts = new Set(stored.score.results.map((r) => r.verdict));
    expect(verdicts.size).toBeGreaterThanOrEqual(4);
    for (const v of verdicts) expect(await page.locator(`.sf-marks .sf-verdict-${v}`).count()).toBeGreaterThan(0);
    // The staff with what the page lays over it (the pitch played, timing ticks).
    const staff = page.getByTestId('drill-staff').first().locator('xpath=..');
    await staff.screenshot({ path: join(shots, 'take-marks-light.png') });
    await page.evaluate(() => document.documentElement.classList.add('dark'));
    await staff.screenshot({ path: join(shots, 'take-marks-dark.png') });
    await page.evaluate(() => document.documentElement.classList.remove('dark'));
  });

  it('leaves no serious accessibility violation on the drills page, in both themes and on a phone', async () => {
    const { page } = b;
    await openDrill({ ...HIGH_WIND, pattern: 'stack' });
    for (const width of [1280, 390]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await seriousViolations(page)).toEqual([]);
      await page.evaluate(() => document.documentElement.classList.add('dark'));
      expect(await seriousViolations(page)).toEqual([]);
      await page.evaluate(() => document.documentElement.classList.remove('dark'));
    }
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it('prints the key cycle through the same staff', async () => {
    const { page } = b;
    for (const [w, name] of [
      [1280, 'desktop'],
      [390, 'phone'],
    ] as const) {
      await page.setViewportSize({ width: w, height: 900 });
      await page.goto(
        `${server.url}/drills/print?${new URLSearchParams({ spec: JSON.stringify(ALTO), order: 'fourths' })}`,
        { waitUntil: 'networkidle' },
      );
      await page.waitForFunction(() => document.querySelectorAll('[data-testid="print-key"] [data-index]').length > 0);
      await page.getByRole('button', { name: 'Print' }).waitFor();
      await page.waitForFunction(() => !(document.querySelector('button:disabled') as HTMLButtonElement | null));
      expect(await page.getByTestId('print-key').count()).toBe(12);
      await page.screenshot({ path: join(shots, `print-cycle-${name}.png`), fullPage: true });
    }
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it('shows the practice page staff with its marks row and key', async () => {
    const { page } = b;
    for (const [w, name] of [
      [1280, 'desktop'],
      [390, 'phone'],
    ] as const) {
      await page.setViewportSize({ width: w, height: 900 });
      await page.goto(`${server.url}/practice?spec=${encodeURIComponent(JSON.stringify(ALTO))}&order=chromatic`, {
        waitUntil: 'networkidle',
      });
      await page.waitForFunction(
        () => document.querySelectorAll('[data-testid="drill-staff"] [data-index]').length > 0,
      );
      await page.screenshot({ path: join(shots, `practice-${name}.png`), fullPage: true });
    }
    await page.setViewportSize({ width: 1280, height: 900 });
  });
});
