import { describe, expect, it } from 'vitest';
import { generateDrill, type PlayedNote, scoreTake } from '../../shared/engine';
import { trendDomain } from '../../src/components/charts/trend-bars';
import { readingWords, readNotes, slipsOf, timingWords } from '../../src/components/review/note-readings';
import { tickScale } from '../../src/components/review/note-strip';

describe('reading a take note by note', () => {
  // D/C four-three at 100 bpm: an eighth is 300 ms.
  const drill = generateDrill({ pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100 });
  const at = (i: number) => (drill.notes[i].beat * 60000) / 100;

  it('names the pitch played instead of a wrong note, and how far ahead or behind each note came', () => {
    const played: PlayedNote[] = drill.notes.map((n, i) => ({
      midi: n.midi + (i === 2 ? 1 : 0),
      timeMs: at(i) + (i === 4 ? 120 : i === 5 ? -110 : 0),
    }));
    const score = scoreTake(drill.notes, played, { tempo: 100, mode: 'timed' });
    const readings = readNotes(drill, { played, score, options: {} });
    expect(readings[2]).toMatchObject({ verdict: 'wrong', written: drill.notes[2].written });
    // one semitone above the written note, spelled with sharps as the drill is (F#4 in D)
    expect(readings[2].played).not.toBeNull();
    expect(readings[4]).toMatchObject({ verdict: 'late', offsetMs: 120 });
    expect(readings[5]).toMatchObject({ verdict: 'early', offsetMs: -110 });
    expect(readingWords(readings[4])).toMatch(/^Note 5, \S+ \(measure 1, beat [\d.]+\): late, 120 ms behind$/);
    expect(readingWords(readings[5])).toMatch(/: early, 110 ms ahead$/);
    expect(slipsOf(readings).map((r) => r.index)).toEqual([2, 4, 5]);
    expect(tickScale(readings)).toBe(120);
  });

  it('reads a transposing instrument in written pitch: an alto a major sixth above concert (common practice)', () => {
    const alto = generateDrill({
      pair: ['D', 'C'],
      pattern: 'four-three',
      direction: 'up',
      tempo: 100,
      instrument: 'alto-sax',
    });
    const played: PlayedNote[] = alto.notes.map((n, i) => ({
      midi: n.midi + (i === 0 ? 2 : 0),
      timeMs: (n.beat * 60000) / 100,
    }));
    const score = scoreTake(alto.notes, played, { tempo: 100, mode: 'timed' });
    const [first] = readNotes(alto, { played, score, options: {} });
    expect(first.verdict).toBe('wrong');
    // two semitones above the written note, in written pitch
    const letters = 'CDEFGAB';
    const step = (s: string) => Number(s.slice(-1)) * 7 + letters.indexOf(s[0]);
    expect(step(first.played ?? '') - step(first.written)).toBe(1);
  });

  it('says the timing in words', () => {
    expect(timingWords(null)).toBe('not played');
    expect(timingWords(0.4)).toBe('on the beat');
    expect(timingWords(-23.4)).toBe('23 ms ahead');
    expect(timingWords(41)).toBe('41 ms behind');
  });
});

describe('trend bars scaled to the figures shown', () => {
  it('puts an 84% and a 94% player far apart, not both near the top', () => {
    const d = trendDomain([0.84, 0.94], { minSpan: 0.1, floor: 0, ceiling: 1 })!;
    expect(d).toEqual({ low: 0.82, high: 0.96 });
    const height = (v: number) => (v - d.low) / (d.high - d.low);
    expect(height(0.94) - height(0.84)).toBeGreaterThan(0.6);
  });

  it('keeps a minimum span, stays inside its bounds, and has nothing to scale without figures', () => {
    expect(trendDomain([0.99, 1], { minSpan: 0.1, floor: 0, ceiling: 1 })).toEqual({ low: 0.9, high: 1 });
    expect(trendDomain([100, 100], { minSpan: 10, floor: 0 })).toEqual({ low: 95, high: 105 });
    expect(trendDomain([null, null], { minSpan: 10 })).toBeNull();
  });
});
