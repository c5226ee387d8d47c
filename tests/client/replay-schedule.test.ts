import { describe, expect, it } from 'vitest';
import { generateDrill } from '../../shared/engine';
import { scheduleReplay } from '../../src/lib/audio/replay';

describe('scheduleReplay: what a take replay plays (practice page and a teacher’s take review alike)', () => {
  const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'stack', direction: 'up', tempo: 120 });

  it('plays the drill as written, softly, each note at its beat', () => {
    const { written } = scheduleReplay(drill, []);
    expect(written).toHaveLength(drill.notes.length);
    drill.notes.forEach((n, i) => {
      // 120 quarters a minute: half a second each
      expect(written[i].time).toBeCloseTo(n.beat * 0.5, 9);
      expect(written[i].duration).toBeCloseTo(n.duration * 0.5 * 0.8, 9);
      expect(written[i].midi).toBe(n.midi);
      expect(written[i].gain).toBe(0.5);
    });
  });

  it('counts dotted quarters in a compound meter', () => {
    // 6/8 at 120: the tempo counts dotted quarters (common practice), so a quarter lasts 1/3 s
    const compound = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', tempo: 120, meter: [6, 8] });
    const { written } = scheduleReplay(compound, []);
    for (const [i, n] of compound.notes.entries()) expect(written[i].time).toBeCloseTo(n.beat / 3, 9);
  });

  it('plays each played note at its own time, with its velocity and length', () => {
    const { played } = scheduleReplay(drill, [
      { midi: 65, timeMs: -40, velocity: 127, durationMs: 400 },
      { midi: 69, timeMs: 510 },
      { midi: 72, timeMs: 1000, velocity: 30, durationMs: 10 },
    ]);
    // a note played before the downbeat sounds on it
    expect(played[0]).toEqual({ time: 0, duration: 0.4, midi: 65, gain: 1 });
    // no note-off and no velocity: a short note at MIDI 1.0 velocity 90 of 127
    expect(played[1]).toEqual({ time: 0.51, duration: 0.15, midi: 69, gain: 90 / 127 });
    // a very short note still sounds long enough to hear
    expect(played[2]).toEqual({ time: 1, duration: 0.08, midi: 72, gain: 30 / 127 });
  });

  it('ends a second after the drill, or after the last note played when that comes later', () => {
    const last = drill.notes.at(-1)!;
    const drillEnd = (last.beat + last.duration) * 0.5;
    expect(scheduleReplay(drill, []).end).toBeCloseTo(drillEnd + 1, 9);
    const late = { midi: 60, timeMs: drillEnd * 1000 + 2000, durationMs: 500 };
    expect(scheduleReplay(drill, [late]).end).toBeCloseTo(drillEnd + 2 + 0.5 + 1, 9);
  });
});
