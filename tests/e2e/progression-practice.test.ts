import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill } from '../../shared/engine';
import type { BrowserSession } from '../helpers/browser';
import type { TestUser } from '../helpers/factories';
import { playerWithKeyboard, playFromOrigin, startTake, takeDone } from '../helpers/practice-page';
import type { startTestServer } from '../helpers/test-server';

// A short ii-V-I at 100 bpm (a beat is 600 ms): 8 beats of triplets, 24 notes, about 5 s.
const SPEC: DrillSpec = {
  pattern: 'weave',
  direction: 'up',
  instrument: 'piano',
  tempo: 100,
  range: { low: 55, high: 84 },
  changes: [
    { chord: 'Dm7', beats: 2 },
    { chord: 'G7', beats: 2 },
    { chord: 'Cmaj7', beats: 4 },
  ],
};
const msPerBeat = 600;

describe('practising a progression drill in Chromium with the fake MIDI device', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let b: BrowserSession;
  let player: TestUser;

  beforeAll(async () => {
    ({ server, player, b } = await playerWithKeyboard('Sam Okafor'));
  });
  afterAll(async () => {
    await b?.close();
    await server?.stop();
  });

  it('shows the chords over the staff, scores the take and counts each chord in its own key', async () => {
    const { page } = b;
    await page.goto(`${server.url}/practice?spec=${encodeURIComponent(JSON.stringify(SPEC))}&order=chromatic`, {
      waitUntil: 'networkidle',
    });
    const staff = page.getByTestId('drill-staff');
    await staff.waitFor();
    await expect.poll(async () => (await staff.textContent()) ?? '').toMatch(/Dm7[\s\S]*G7[\s\S]*Cmaj7/);
    await page.getByLabel('Count-in').selectOption('0');
    await page.waitForFunction(() =>
      document.querySelector('[data-testid="input-status"]')?.textContent?.includes('Listening to Fake Keyboard'),
    );
    const drill = generateDrill(SPEC);
    // every note in time; the G7 notes a half step off
    const script = drill.notes.map((n) => ({
      midi: drill.changes?.[n.chordIndex as number].chord === 'G7' ? n.midi + 1 : n.midi,
      t: n.beat * msPerBeat,
    }));
    await startTake(page);
    await playFromOrigin(page, script, 120);
    await takeDone(page);
    const g7 = drill.notes.filter((n) => drill.changes?.[n.chordIndex as number].chord === 'G7').length;
    const pct = Math.round(((drill.notes.length - g7) / drill.notes.length) * 100);
    expect(await page.getByTestId('accuracy').textContent()).toBe(`${pct}%`);

    // stored once, with the progression, each note counted for its chord's key
    let rows: Array<{ key: string; n: number; errors: number }> = [];
    for (let i = 0; i < 50 && rows.length === 0; i++) {
      const res = await server.pool.query(
        `SELECT n.key, count(*)::int AS n, count(*) FILTER (WHERE n.verdict <> 'hit')::int AS errors
         FROM take_notes n JOIN takes t ON t.id = n.take_id WHERE t.player_id = $1 GROUP BY 1 ORDER BY 1`,
        [player.id],
      );
      rows = res.rows;
      if (rows.length === 0) await new Promise((r) => setTimeout(r, 200));
    }
    expect(rows).toEqual([
      { key: 'C', n: 12, errors: 0 },
      { key: 'D', n: 6, errors: 0 },
      { key: 'G', n: 6, errors: 6 },
    ]);
    const take = await server.pool.query('SELECT spec FROM takes WHERE player_id = $1', [player.id]);
    expect(take.rows[0].spec.changes.map((c: { chord: string }) => c.chord)).toEqual(['Dm7', 'G7', 'Cmaj7']);
    expect(b.errors).toEqual([]);
  });
});
