import { Note } from 'tonal';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, expectedTimeMs, generateDrill, sliceDrill } from '../../shared/engine';
import { seriousViolations, violationsInBothThemes } from '../helpers/axe';
import type { BrowserSession } from '../helpers/browser';
import type { TestUser } from '../helpers/factories';
import { playerWithKeyboard, takeDone as takeScored } from '../helpers/practice-page';
import type { startTestServer } from '../helpers/test-server';

/**
 * The practice page's live marks, loop, ladder and pitch frame in Chromium with the fake MIDI
 * device. Late delivery is made by sending an event after its own timestamp (the fake device
 * takes any timestamp, as a busy page or a slow USB hub delivers one late).
 */

// 100 bpm weave: triplet eighths 200 ms apart; each note's match window is 150 ms.
const SPEC: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up',
  instrument: 'piano',
  tempo: 100,
  range: { low: 60, high: 88 },
};

type Page = BrowserSession['page'];
interface Send {
  midi: number;
  /** take time the note is played (its event's timestamp) */
  t: number;
  /** how long after its timestamp the event reaches the page */
  delay: number;
}

/** The take's first downbeat on the page's clock, from the staff's test hook. */
async function downbeat(page: Page): Promise<number> {
  await page.waitForFunction(() =>
    document.querySelector('[data-testid="drill-staff"]')?.hasAttribute('data-downbeat-ms'),
  );
  return Number(await page.getByTestId('drill-staff').getAttribute('data-downbeat-ms'));
}

/** Sends notes on the fake device, each stamped with its own time and delivered `delay` ms later. */
async function send(page: Page, notes: Send[]) {
  const origin = await downbeat(page);
  expect(origin).toBeGreaterThan(0);
  await page.evaluate(
    ({ origin, notes }) => {
      for (const n of notes) {
        const at = origin + n.t;
        setTimeout(
          () => {
            window.__fakeMidi.noteOn(n.midi, 90, 1, at);
            window.__fakeMidi.noteOff(n.midi, 0, 1, at + 100);
          },
          Math.max(0, at + n.delay - performance.now()),
        );
      }
    },
    { origin, notes },
  );
}

/**
 * Watches every mark as it lands on the staff: a mark on a note whose time has not come is
 * written down, and so is every verdict each note ever showed.
 */
async function watchMarks(page: Page, times: number[]) {
  await page.evaluate((times) => {
    const w = window as unknown as { __marks: { early: string[]; seen: Record<number, string[]> } };
    w.__marks = { early: [], seen: {} };
    const staff = document.querySelector('[data-testid="drill-staff"]');
    if (!staff) throw new Error('no staff');
    const check = () => {
      const origin = Number(staff.getAttribute('data-downbeat-ms'));
      if (!origin) return;
      const now = performance.now() - origin;
      for (const el of staff.querySelectorAll('[data-index]')) {
        const v = el.getAttribute('data-verdict') ?? '';
        if (!v) continue;
        const i = Number(el.getAttribute('data-index'));
        w.__marks.seen[i] ??= [];
        const seen = w.__marks.seen[i];
        if (seen.at(-1) !== v) seen.push(v);
        if (times[i] > now) w.__marks.early.push(`note ${i} ${v} at ${now.toFixed(0)} ms, due at ${times[i]}`);
      }
    };
    new MutationObserver(check).observe(staff, { attributes: true, subtree: true, attributeFilter: ['data-verdict'] });
  }, times);
}

const takeDone = (page: Page) => takeScored(page, 30_000);

async function finalMarks(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('[data-testid="drill-staff"] [data-index]')]
      .sort((a, b) => Number(a.getAttribute('data-index')) - Number(b.getAttribute('data-index')))
      .map((el) => el.getAttribute('data-verdict') ?? ''),
  );
}

describe('practice page: live marks, loop, ladder and pitch frame in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let b: BrowserSession;
  let player: TestUser;

  beforeAll(async () => {
    ({ server, player, b } = await playerWithKeyboard('Ada Quill'));
  });
  afterAll(async () => {
    await b?.close();
    await server?.stop();
  });

  async function open(spec: DrillSpec, countIn = '0') {
    const { page } = b;
    await page.goto(`${server.url}/practice?spec=${encodeURIComponent(JSON.stringify(spec))}&order=chromatic`, {
      waitUntil: 'networkidle',
    });
    await page.getByTestId('drill-staff').waitFor();
    await page.getByLabel('Count-in').selectOption(countIn);
    await page.waitForFunction(() =>
      document.querySelector('[data-testid="input-status"]')?.textContent?.includes('Listening to Fake Keyboard'),
    );
  }

  async function takesStored(): Promise<number> {
    const res = await server.pool.query('SELECT count(*)::int AS n FROM takes WHERE player_id = $1', [player.id]);
    return res.rows[0].n;
  }

  /** The verdicts the server stored for the player's newest take, once there are `count` takes. */
  async function serverVerdicts(count: number): Promise<string[]> {
    for (let i = 0; i < 75 && (await takesStored()) < count; i++) await new Promise((r) => setTimeout(r, 200));
    const res = await server.pool.query(
      `SELECT n.verdict FROM take_notes n
        WHERE n.take_id = (SELECT id FROM takes WHERE player_id = $1 ORDER BY created_at DESC LIMIT 1)
        ORDER BY n.idx`,
      [player.id],
    );
    return res.rows.map((r: { verdict: string }) => r.verdict);
  }

  const drill = generateDrill(SPEC);
  const times = drill.notes.map((n) => expectedTimeMs(n.beat, 100, 0.5));
  // How long each note's event takes to reach the page after its own timestamp. (How often a
  // played note may show missed for a moment is checked in the unit tests, on a clock of their
  // own: here a busy machine adds delays of its own.)
  const cases: Array<[string, (i: number) => number]> = [
    ['one event 90 ms late', (i) => (i === 4 ? 90 : 0)],
    ['every event 90 ms late', () => 90],
    ['one event 250 ms late', (i) => (i === 4 ? 250 : 0)],
    ['every event 250 ms late', () => 250],
    ['a late start: the first three events 250 ms late', (i) => (i < 3 ? 250 : 0)],
  ];

  for (const [name, delay] of cases) {
    it(`${name}: nothing upcoming is marked, and the final marks are the server's`, async () => {
      const { page } = b;
      await open(SPEC);
      const before = await takesStored();
      await page.getByRole('button', { name: /Start (the|another) take/ }).click();
      await watchMarks(page, times);
      await send(
        page,
        drill.notes.map((n, i) => ({ midi: n.midi, t: times[i], delay: delay(i) })),
      );
      await takeDone(page);
      const watched = await page.evaluate(() => (window as unknown as { __marks: { early: string[] } }).__marks);
      expect(watched.early).toEqual([]);
      const marks = await finalMarks(page);
      expect(marks).toEqual(drill.notes.map(() => 'hit'));
      expect(await serverVerdicts(before + 1)).toEqual(marks);
      expect(b.errors).toEqual([]);
    });
  }

  it('a left-out note is marked missed during the take, nothing before its time, and stopping logs no console error', async () => {
    const { page } = b;
    await open(SPEC);
    const before = await takesStored();
    await page.getByRole('button', { name: /Start (the|another) take/ }).click();
    await watchMarks(page, times);
    await send(
      page,
      drill.notes.flatMap((n, i) => (i === 2 || i > 8 ? [] : [{ midi: n.midi, t: times[i], delay: 90 }])),
    );
    await page.waitForSelector('[data-index="2"][data-verdict="missed"]', { state: 'attached', timeout: 10_000 });
    await page.waitForSelector('[data-index="8"][data-verdict="hit"]', { state: 'attached', timeout: 10_000 });
    await page.getByRole('button', { name: /^Stop/ }).click();
    await takeDone(page);
    const watched = await page.evaluate(() => (window as unknown as { __marks: { early: string[] } }).__marks);
    expect(watched.early).toEqual([]);
    const marks = await finalMarks(page);
    const server = await serverVerdicts(before + 1);
    expect(marks.slice(0, server.length)).toEqual(server);
    expect(server[2]).toBe('missed');
    // Let the stopped sound finish releasing: nothing may reach the console.
    await page.waitForTimeout(1000);
    expect(b.errors).toEqual([]);
  });

  it('loops a passage at its own tempo, counted in, every pass a take, climbing toward the drill tempo', async () => {
    const { page } = b;
    const spec: DrillSpec = { ...SPEC, range: { low: 60, high: 84 }, tempo: 160 };
    await open(spec);
    const full = generateDrill(spec);
    expect(full.measures).toBeGreaterThanOrEqual(2);
    await page.getByLabel('From measure').fill('2');
    await page.getByLabel('To measure').fill('2');
    await page.getByLabel('Loop tempo (bpm)').fill('152');
    await page.getByRole('button', { name: 'Loop these measures' }).click();
    const passage = sliceDrill(full, 2, 2);
    await page.getByRole('button', { name: /Start (the|another) take/ }).click();
    // Common practice for a tempo climb: a clean pass adds 4 bpm; the loop stops at the drill's 160.
    const tempos = [152, 156, 160, 160];
    for (const [pass, tempo] of tempos.entries()) {
      const loop = page.getByTestId('loop');
      await page.waitForFunction(
        (p) => document.querySelector('[data-testid="loop"]')?.getAttribute('data-passes') === String(p),
        pass,
      );
      expect(await loop.getAttribute('data-tempo')).toBe(String(tempo));
      // Each pass begins with a count-in, though the page's count-in is set to none.
      await page.waitForFunction(
        () => document.querySelector('[data-testid="practice"]')?.getAttribute('data-phase') === 'count-in',
      );
      const ms = 60000 / tempo;
      await send(
        page,
        passage.notes.map((n) => ({ midi: n.midi, t: n.beat * ms, delay: 0 })),
      );
      await page.waitForFunction(
        (p) => document.querySelector('[data-testid="loop"]')?.getAttribute('data-passes') === String(p + 1),
        pass,
        { timeout: 15_000 },
      );
    }
    await page.getByRole('button', { name: /^Stop/ }).click();
    await takeDone(page);
    await page.getByRole('button', { name: 'End the loop' }).click();
    let rows: Array<{ f: number; t: number; tempo: number; accuracy: number }> = [];
    for (let i = 0; i < 50 && rows.length < 4; i++) {
      const res = await server.pool.query(
        `SELECT measure_from AS f, measure_to AS t, tempo, accuracy FROM takes
          WHERE player_id = $1 AND measure_from = 2 AND stopped_at_ms IS NULL ORDER BY created_at`,
        [player.id],
      );
      rows = res.rows;
      if (rows.length < 4) await new Promise((r) => setTimeout(r, 200));
    }
    expect(rows.map((r) => [r.f, r.t, r.tempo, r.accuracy])).toEqual(tempos.map((t) => [2, 2, t, 1]));
    expect(b.errors).toEqual([]);
  });

  it('a ladder step starts with clean marks and shows its own measure number', async () => {
    const { page } = b;
    const spec: DrillSpec = { ...SPEC, range: { low: 60, high: 84 }, tempo: 160 };
    await open(spec);
    await page.getByLabel('Ladder (memorise measure by measure)').check();
    const full = generateDrill(spec);
    const step1 = sliceDrill(full, 1, 1);
    for (let take = 0; take < 2; take++) {
      await page.getByRole('button', { name: /Start (the|another) take/ }).click();
      await send(
        page,
        step1.notes.map((n) => ({ midi: n.midi, t: (n.beat * 60000) / 160, delay: 0 })),
      );
      await takeDone(page);
    }
    expect(await page.getByTestId('ladder-step').getAttribute('data-from')).toBe('2');
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="drill-staff"] [data-index]').length > 0);
    expect(new Set(await finalMarks(page))).toEqual(new Set(['']));
    expect(await page.getByTestId('drill-staff').getAttribute('class')).not.toContain('sf-faded');
    expect(await page.locator('.sf-fade-1').count()).toBe(1);
    // The bar number printed at the start of the step's staff is its own measure: 2.
    const numbers = await page.evaluate(() =>
      [...document.querySelectorAll('[data-testid="drill-staff"] svg text')]
        .map((t) => t.textContent?.trim() ?? '')
        .filter((s) => /^\d+$/.test(s)),
    );
    expect(numbers).toContain('2');
    expect(numbers).not.toContain('1');
  });

  it('an alto player reads keys, pairs, the keyboard and a wrong note in written pitch', async () => {
    const { page } = b;
    const spec: DrillSpec = { ...SPEC, instrument: 'alto-sax', range: { low: 60, high: 76 } };
    await open(spec);
    // From memory: the alto saxophone in Eb sounds a major sixth below written, so concert F / Eb
    // is written D / C, and its lowest concert note, Db3, is written Bb3 (MIDI 58).
    expect(await page.getByTestId('drill-summary').textContent()).toMatch(/^D \/ C \(concert F \/ Eb\)/);
    const current = page.getByRole('navigation', { name: 'Keys of the cycle' }).locator('[aria-current="true"]');
    expect(await current.textContent()).toBe('Dconcert F');
    expect(
      await page.locator('svg[aria-label^="Alto saxophone range in written pitch"] rect[data-midi="58"]').count(),
    ).toBe(1);
    const written = generateDrill(spec);
    // "My keyboard plays written pitch" off: the keyboard sends concert pitch; note 1 a semitone high.
    await page.getByRole('button', { name: /Start (the|another) take/ }).click();
    await send(
      page,
      written.notes.map((n, i) => ({ midi: i === 1 ? n.midi + 1 : n.midi, t: (n.beat * 60000) / 100, delay: 0 })),
    );
    await takeDone(page);
    const slip = await page.getByTestId('slipped').locator('li[data-index="1"]').textContent();
    const m = /· (\S+) wrong \(played (\S+)\)/.exec(slip ?? '');
    expect(m).not.toBeNull();
    const [, expected, played] = m!;
    expect(expected).toBe(written.notes[1].written);
    // tonal: the played name is the written note a semitone above the expected one
    expect(Note.midi(played)).toBe((Note.midi(expected) ?? 0) + 1);
  });

  it('offers no suggested tempo equal to the tempo already set', async () => {
    const { page } = b;
    const spec: DrillSpec = { ...SPEC, pair: ['D', 'C'], range: { low: 60, high: 76 } };
    await open(spec);
    const d = generateDrill(spec);
    await page.getByRole('button', { name: /Start (the|another) take/ }).click();
    await send(
      page,
      d.notes.map((n) => ({ midi: n.midi, t: (n.beat * 60000) / 100, delay: 0 })),
    );
    await takeDone(page);
    await page.getByRole('button', { name: 'Use 104 bpm' }).click();
    expect(await page.getByLabel('Tempo (bpm)', { exact: true }).inputValue()).toBe('104');
    expect(await page.getByRole('button', { name: /Suggested tempo/ }).count()).toBe(0);
    expect(await page.getByTestId('tempo-climb').count()).toBe(0);
  });

  it('has no serious accessibility violation in either theme, on a desktop and a phone', async () => {
    const { page } = b;
    await open(SPEC);
    // with a finished take on screen, so the results and marks are checked too
    await page.getByRole('button', { name: /Start (the|another) take/ }).click();
    await send(
      page,
      drill.notes.map((n, i) => ({ midi: i === 3 ? n.midi + 1 : n.midi, t: times[i], delay: 0 })),
    );
    await takeDone(page);
    // Light, then dark through the page's own switch (the take's results stay on screen).
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole('button', { name: 'Switch to the dark theme' }).click();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole('button', { name: 'Switch to the light theme' }).click();
    await page.setViewportSize({ width: 390, height: 844 });
    try {
      expect(await violationsInBothThemes(page)).toEqual({ light: [], dark: [] });
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow).toBeLessThanOrEqual(0);
    } finally {
      await page.setViewportSize({ width: 1280, height: 900 });
    }
  }, 120_000);
});
