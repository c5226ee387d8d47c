import { Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import { type ChordChange, EngineError, generateDrill, sliceDrill } from '../../shared/engine';
import { drillKey, drillMaterial, drillShape } from '../../shared/practice/drill-identity';
import { STARTING_PROGRESSIONS, chartOf, parseChart, splitBar } from '../../shared/practice/progressions';
import { DrillSpec } from '../../shared/schemas/drills';
import { padVoicing, scheduleDrill } from '../../src/lib/audio/schedule';

describe('bar charts', () => {
  it('reads bars, two chords splitting a bar, a chord held over the bar line as one change', () => {
    expect(parseChart('| Dm7 G7 | Cmaj7 | Cmaj7 |', [4, 4])).toEqual([
      { chord: 'Dm7', beats: 2 },
      { chord: 'G7', beats: 2 },
      { chord: 'Cmaj7', beats: 8 },
    ]);
    // "%" repeats the bar before; without bar lines each chord is a bar
    expect(parseChart('| F7 Bb7 | % |', [4, 4]).map((c) => c.beats)).toEqual([2, 2, 2, 2]);
    expect(parseChart('Dm7 G7 Cmaj7', [3, 4]).map((c) => c.beats)).toEqual([3, 3, 3]);
  });

  it('shares a bar by the meter’s beats, the first chord taking the extra one', () => {
    expect(splitBar(2, [4, 4])).toEqual([2, 2]);
    expect(splitBar(3, [4, 4])).toEqual([2, 1, 1]);
    expect(splitBar(2, [3, 4])).toEqual([2, 1]);
    // 6/8: two dotted-quarter beats (common practice)
    expect(splitBar(2, [6, 8])).toEqual([1.5, 1.5]);
    expect(splitBar(5, [4, 4])).toBeNull();
  });

  it('names a bad symbol and its bar, and a bar with too many chords', () => {
    expect(() => parseChart('| Dm7 G7 | Cxq7 |', [4, 4])).toThrow(/Bar 2.*Cxq7/);
    expect(() => parseChart('| Dm7 G7 A7 D7 E7 |', [4, 4])).toThrow(/Bar 1 holds 5 chords/);
    expect(() => parseChart('  ', [4, 4])).toThrow(EngineError);
    expect(() => parseChart('| % |', [4, 4])).toThrow(/repeats/);
  });

  it('keeps a pin where the same chord stays in place', () => {
    const before: ChordChange[] = [
      { chord: 'Dm7', beats: 4 },
      { chord: 'G7', beats: 4, pair: ['Db', 'Eb'] },
    ];
    expect(parseChart('| Dm7 | G7 | C6 |', [4, 4], before)[1].pair).toEqual(['Db', 'Eb']);
    expect(parseChart('| Dm7 | A7 |', [4, 4], before)[1].pair).toBeUndefined();
  });

  it('writes changes back as a chart that reads the same', () => {
    for (const p of STARTING_PROGRESSIONS) {
      const changes = parseChart(p.chart, [4, 4]);
      expect(parseChart(chartOf(changes, [4, 4]), [4, 4])).toEqual(changes);
      // every starting progression is a drill the schema and the engine accept
      const spec = { pattern: 'weave' as const, direction: 'up' as const, changes };
      expect(DrillSpec.safeParse(spec).success).toBe(true);
      expect(generateDrill(spec).notes.length).toBeGreaterThan(0);
    }
  });
});

describe('a progression drill elsewhere in the app', () => {
  const changes: ChordChange[] = [
    { chord: 'Dm7', beats: 4 },
    { chord: 'G7', beats: 4 },
    { chord: 'Cmaj7', beats: 8 },
  ];
  const drill = generateDrill({ pattern: 'four-three', direction: 'up', changes, tempo: 120 });

  it('the chord pad follows the changes: each chord voiced for its own beats', () => {
    const pads = scheduleDrill(drill, { pad: true, click: false, countInMeasures: 1 }).events.filter(
      (e) => e.kind === 'pad',
    );
    // 120 bpm: a quarter is 0.5 s, the count-in a 4/4 bar (2 s)
    expect(pads.map((e) => e.time)).toEqual([2, 4, 6]);
    expect(pads.map((e) => (e.kind === 'pad' ? e.midis : []))).toEqual(changes.map((c) => padVoicing(c.chord)));
    // tonal: Dm7 is D F A C
    expect(padVoicing('Dm7').map((m) => Note.pitchClass(Note.fromMidi(m)))).toEqual(['D', 'F', 'A', 'C']);
  });

  it('a ladder step keeps the chords under its measures, re-based', () => {
    const step = sliceDrill(drill, 2, 3);
    expect(step.changes?.map((c) => [c.chord, c.startBeat, c.beats])).toEqual([
      ['G7', 0, 4],
      ['Cmaj7', 4, 4],
    ]);
    for (const n of step.notes) {
      const c = step.changes?.[n.chordIndex as number];
      expect(n.beat).toBeGreaterThanOrEqual(c?.startBeat ?? Number.NaN);
    }
  });

  it('a progression drill is keyed by its first chord and named by its chords', () => {
    expect(drillKey({ changes })).toBe('D');
    expect(drillKey({ changes: [{ chord: 'C#m7', beats: 4 }] })).toBe('Db');
    expect(drillMaterial({ changes })).toBe('Dm7 G7 Cmaj7');
    // the same progression a whole step up is the same drill in another key
    const up = changes.map((c) => ({
      ...c,
      chord: c.chord.replace(/^[A-G]/, (r) => ({ D: 'E', G: 'A', C: 'D' })[r] ?? r),
    }));
    const spec = { pattern: 'weave' as const, direction: 'up' as const };
    expect(drillShape({ ...spec, changes: up })).toBe(drillShape({ ...spec, changes }));
    expect(drillShape({ ...spec, changes })).not.toBe(drillShape({ ...spec, changes, choruses: 2 }));
  });
});
