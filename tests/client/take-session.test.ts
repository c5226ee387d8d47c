import { describe, expect, it } from 'vitest';
import { type DrillSpec, expectedTimeMs, generateDrill, scoreTake } from '../../shared/engine';
import { TakeSession } from '../../src/features/practice/lib/take-session';

// 100 bpm weave: triplet eighths 200 ms apart, so each note's match window is 150 ms.
const SPEC: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up',
  instrument: 'piano',
  tempo: 100,
  range: { low: 60, high: 88 },
};
const drill = generateDrill(SPEC);
const options = { tempo: 100, mode: 'timed' as const };
const times = drill.notes.map((n) => expectedTimeMs(n.beat, 100, 0.5));
const ORIGIN = 1000;

interface Delivery {
  /** index of the drill note played */
  i: number;
  /** take time the note was played (its event's own timestamp) */
  t: number;
  /** how long after its timestamp the event reaches the page */
  delay: number;
}

/**
 * Runs a take frame by frame (every 16 ms of the page clock), delivering each note when its
 * delay has passed, and records what the marks showed along the way.
 */
function run(deliveries: Delivery[]) {
  const s = new TakeSession(drill, options, 0, 0, ORIGIN);
  const pending = [...deliveries].sort((a, b) => a.t + a.delay - (b.t + b.delay));
  const early: string[] = [];
  const shownMissed = new Set<number>();
  for (let now = ORIGIN; ; now += 16) {
    while (pending.length > 0 && ORIGIN + pending[0].t + pending[0].delay <= now) {
      const d = pending.shift()!;
      s.note(
        {
          type: 'on',
          midi: drill.notes[d.i].midi,
          velocity: 90,
          timeStamp: ORIGIN + d.t,
          source: 'midi',
          deviceId: null,
        },
        now,
      );
    }
    const { over } = s.frame(now);
    const t = now - ORIGIN;
    for (const [i, m] of s.marks()) {
      // A note whose time has not come is never marked (nothing in these takes is played early).
      if (times[i] > t) early.push(`${i} ${m.verdict} at ${t}`);
      if (m.verdict === 'missed') shownMissed.add(i);
    }
    if (over && pending.length === 0) break;
  }
  const take = s.finish();
  return { take, early, shownMissed, session: s };
}

const onTime = (delay: (i: number) => number) => drill.notes.map((_, i) => ({ i, t: times[i], delay: delay(i) }));

describe('live marks when note events reach the page late', () => {
  it.each([
    ['one note 90 ms late', onTime((i) => (i === 5 ? 90 : 0))],
    ['one note 250 ms late', onTime((i) => (i === 5 ? 250 : 0))],
    ['every note 90 ms late', onTime(() => 90)],
    ['every note 250 ms late', onTime(() => 250)],
  ])('%s: nothing upcoming is marked, and the take scores every note hit', (_name, deliveries) => {
    const { take, early, shownMissed } = run(deliveries);
    expect(early).toEqual([]);
    expect(take.score.accuracy).toBe(1);
    // At most the one note whose lateness was the first seen can have shown missed for a moment
    // (its window closed before the event arrived); once a lag is seen, no played note shows missed.
    expect(shownMissed.size).toBeLessThanOrEqual(1);
  });

  it('a 90 ms lag never shows a miss: the window (150 ms) and margin cover it', () => {
    expect(run(onTime(() => 90)).shownMissed.size).toBe(0);
    expect(run(onTime((i) => (i === 5 ? 90 : 0))).shownMissed.size).toBe(0);
  });

  it('a late start: the first notes left out, the rest arriving 250 ms late', () => {
    const deliveries = onTime(() => 250).filter((d) => d.i >= 3);
    const { take, early, shownMissed, session } = run(deliveries);
    expect(early).toEqual([]);
    expect(take.score.results.map((r) => r.verdict)).toEqual(drill.notes.map((_, i) => (i < 3 ? 'missed' : 'hit')));
    expect(take.score).toEqual(scoreTake(drill.notes, session.played, options));
    expect([...shownMissed].every((i) => i <= 3)).toBe(true);
  });

  it('a late event before an earlier-stamped one keeps the played notes in time order', () => {
    // note 6's event overtakes note 5's: 5 arrives 250 ms late, 6 on time
    const { take, session } = run(onTime((i) => (i === 5 ? 250 : 0)));
    const ts = session.played.map((p) => p.timeMs);
    expect(ts).toEqual([...ts].sort((a, b) => a - b));
    expect(take.score).toEqual(scoreTake(drill.notes, session.played, options));
  });

  it('shows a left-out note missed only once its window has closed on the lagged clock', () => {
    const lag = 250;
    const deliveries = onTime(() => lag).filter((d) => d.i !== 8);
    const s = new TakeSession(drill, options, 0, 0, ORIGIN);
    const pending = [...deliveries];
    let firstShown: number | null = null;
    for (let now = ORIGIN; now < ORIGIN + times[12]; now += 5) {
      while (pending.length > 0 && ORIGIN + pending[0].t + pending[0].delay <= now) {
        const d = pending.shift()!;
        s.note(
          {
            type: 'on',
            midi: drill.notes[d.i].midi,
            velocity: 90,
            timeStamp: ORIGIN + d.t,
            source: 'midi',
            deviceId: null,
          },
          now,
        );
      }
      s.frame(now);
      if (firstShown === null && s.marks().get(8)?.verdict === 'missed') firstShown = now - ORIGIN;
    }
    expect(s.deliveryLagMs).toBe(lag);
    expect(firstShown).not.toBeNull();
    // 150 ms match window (100 bpm triplets) plus the lag seen plus the 50 ms margin
    expect(firstShown!).toBeGreaterThanOrEqual(times[8] + 150 + lag + 50);
  });
});
