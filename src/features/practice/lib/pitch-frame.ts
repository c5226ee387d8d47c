import { type DrillSpec, type InstrumentId, instruments, parseTriad, writtenPair } from '@shared/engine';
import { semitoneInterval } from '@shared/engine/theory/pair-spelling';
import { chromaOf, rootSpelling } from '@shared/engine/theory/spelling';
import { drillKey } from '@shared/practice/drill-identity';
import { Chord, Note } from 'tonal';

/**
 * One pitch frame per player: a player whose instrument transposes reads everything in written
 * pitch (keys, pairs, chords, note names, the on-screen keyboard, range labels), the pitch the
 * staff shows and her fingers play. `concert` gives the sounding name for small print beside it.
 */
export interface PitchFrame {
  /** true when written and concert pitch differ by more than whole octaves */
  transposing: boolean;
  /** semitones from written to concert (alto saxophone: -9) */
  transposition: number;
  /** a key (root name) in the frame: concert Eb reads C on an alto saxophone */
  key(concertKey: string): string;
  /**
   * A drill's key in the frame. Concert: its key as the key map counts it. Written: the root of
   * the written pair's first triad, spelled as the pair is (concert B / A on alto reads Ab, Bm / A
   * reads G#), or over a progression the root of the first chord as written.
   */
  drillKey(spec: Pick<DrillSpec, 'pair' | 'changes'>): string;
  /** a pair's two triad symbols in the frame, spelled as one unit (the engine's writtenPair) */
  pair(pair: readonly [string, string]): [string, string];
  /** a chord symbol in the frame */
  chord(symbol: string): string;
  /** concert MIDI -> the MIDI number of the written note */
  written(concertMidi: number): number;
  /** a written MIDI number's name with octave, spelled like `like` when that is the same pitch class */
  name(writtenMidi: number, like?: string): string;
}

const spell = (midi: number, like?: string) => {
  const sharps = like ? /#/.test(like) : false;
  const name = sharps ? Note.fromMidiSharps(midi) : Note.fromMidi(midi);
  if (like) {
    // Same pitch class as the note it is compared with: keep that note's letter.
    const l = Note.get(like);
    if (!l.empty && l.chroma === ((midi % 12) + 12) % 12) return `${l.pc}${Math.floor((midi - l.alt) / 12) - 1}`;
  }
  return name;
};

/** The pitch frame of a player on an instrument. */
export function pitchFrame(instrument: InstrumentId): PitchFrame {
  const transposition = instruments[instrument].transposition;
  const transposing = transposition % 12 !== 0;
  const up = semitoneInterval(-transposition);
  const chord = (c: string) => (transposing ? Chord.transpose(c, up) || c : c);
  return {
    transposing,
    transposition,
    key: (k) => (transposing ? rootSpelling((((chromaOf(k) - transposition) % 12) + 12) % 12) : k),
    drillKey: (spec) => {
      if (!transposing) return drillKey(spec);
      const first = spec.changes?.[0];
      if (first) return Chord.tokenize(chord(first.chord))[0] || drillKey(spec);
      if (!spec.pair) return drillKey(spec);
      return parseTriad(writtenPair([spec.pair[0], spec.pair[1]], instrument)[0]).root;
    },
    pair: (p) => (transposing ? writtenPair([p[0], p[1]], instrument) : [p[0], p[1]]),
    chord,
    written: (m) => m - transposition,
    name: (m, like) => spell(m, like),
  };
}
