import { Chord, Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import { pairsForChord } from '../../shared/engine';
import { scheduleScalePreview } from '../../src/lib/audio/scale-preview';

describe('scheduleScalePreview', () => {
  it.each(['D7', 'G7alt', 'Cmaj7#11', 'Fm7'])(
    "%s: the first pair's six notes up an octave and back, over the chord pad",
    (chord) => {
      const fit = pairsForChord(chord)[0];
      const { events, end } = scheduleScalePreview(fit.notes, chord);
      const notes = events.filter((e) => e.kind === 'note');
      const pads = events.filter((e) => e.kind === 'pad');
      // six notes, the octave, then five back down to where it began
      expect(notes).toHaveLength(13);
      const midis = notes.map((e) => (e.kind === 'note' ? e.midi : 0));
      expect(midis.slice(0, 7)).toEqual([...midis.slice(0, 7)].sort((a, b) => a - b));
      expect(midis[6] - midis[0]).toBe(12);
      expect(midis.slice(6)).toEqual([...midis.slice(0, 7)].reverse());
      // every note is one of the pair's, by pitch class (tonal), each heard once on the way up
      const scale = fit.pair.hexatonic.map((n) => Note.chroma(n));
      expect(new Set(midis.slice(0, 6).map((m) => m % 12))).toEqual(new Set(scale));
      // the line starts on the chord's root when the pair holds it (tonal's Chord.get gives the root)
      const root = Note.chroma(Chord.get(chord).tonic as string) as number;
      if (scale.includes(root)) expect(midis[0] % 12).toBe(root);
      // notes one after another, the pad holds the chord's tones (tonal) under all of them
      for (const [i, e] of notes.entries()) expect(e.time).toBeCloseTo(i * 0.22, 9);
      expect(pads).toHaveLength(1);
      const pad = pads[0];
      expect(pad.kind === 'pad' && new Set(pad.midis.map((m) => m % 12))).toEqual(
        new Set(Chord.get(chord).notes.map((n) => Note.chroma(n))),
      );
      expect(pad.kind === 'pad' && pad.time + pad.duration).toBeGreaterThan(notes[12].time);
      expect(end).toBeGreaterThan(notes[12].time);
    },
  );
});
