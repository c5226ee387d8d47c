import { type Drill, instruments, type PlayedNote, type ScoreOptions, type TakeScore } from '@shared/engine';
import { Note } from 'tonal';

export type Verdict = TakeScore['results'][number]['verdict'];

/** One written note of a take, as written and as played. */
export interface NoteReading {
  index: number;
  /** as written for the instrument, e.g. "F#4" */
  written: string;
  measure: number;
  beatInMeasure: number;
  verdict: Verdict;
  /** played time minus written time; negative is ahead of the beat */
  offsetMs: number | null;
  /** what was played instead, in the same written pitch, for a wrong note */
  played: string | null;
}

/** How a take was played: enough of the stored take to read each note. */
export interface TakeForReading {
  played: PlayedNote[];
  score: TakeScore;
  options: Pick<ScoreOptions, 'inputTransposition'>;
}

const round = (n: number) => Math.round(n * 100) / 100;

/**
 * Each written note of the take with its verdict, its timing and, for a wrong note, the pitch
 * that was played, spelled in written pitch for the drill's instrument (sharps when the drill
 * is written with sharps, else flats).
 *
 * @example
 * readNotes(drill, take)[3] // { written: 'F#4', verdict: 'wrong', played: 'G4', offsetMs: 12, ... }
 */
export function readNotes(drill: Drill, take: TakeForReading): NoteReading[] {
  const transposition = instruments[drill.spec.instrument]?.transposition ?? 0;
  const sharps = drill.notes.some((n) => n.written.includes('#'));
  const spell = (midi: number) => (sharps ? Note.fromMidiSharps(midi) : Note.fromMidi(midi));
  return drill.notes.map((n, index) => {
    const r = take.score.results[index] ?? { verdict: 'missed' as const, playedIndex: null, offsetMs: null };
    const p = r.playedIndex !== null ? take.played[r.playedIndex] : undefined;
    // The scorer heard played + input transposition (concert); written = concert - the instrument's transposition.
    const heard = p ? p.midi + (take.options.inputTransposition ?? 0) - transposition : null;
    return {
      index,
      written: n.written,
      measure: n.measure,
      beatInMeasure: round(n.beatInMeasure),
      verdict: r.verdict,
      offsetMs: r.offsetMs,
      played: r.verdict === 'wrong' && heard !== null ? spell(heard) : null,
    };
  });
}

const ms = (v: number) => `${Math.abs(Math.round(v))} ms`;

/** The note's timing in words: "on the beat", "23 ms ahead", "41 ms behind". */
export function timingWords(offsetMs: number | null): string {
  if (offsetMs === null) return 'not played';
  if (Math.abs(offsetMs) < 1) return 'on the beat';
  return offsetMs < 0 ? `${ms(offsetMs)} ahead` : `${ms(offsetMs)} behind`;
}

/** Where the note sits: "measure 3, beat 2.5". */
export const placeWords = (r: NoteReading) => `measure ${r.measure}, beat ${r.beatInMeasure}`;

/** One note in words, e.g. "Note 12, F#4 (measure 3, beat 2): played G4 instead, 12 ms behind". */
export function readingWords(r: NoteReading): string {
  const head = `Note ${r.index + 1}, ${r.written} (${placeWords(r)})`;
  switch (r.verdict) {
    case 'hit':
      return `${head}: hit, ${timingWords(r.offsetMs)}`;
    case 'early':
      return `${head}: early, ${timingWords(r.offsetMs)}`;
    case 'late':
      return `${head}: late, ${timingWords(r.offsetMs)}`;
    case 'wrong':
      return `${head}: played ${r.played ?? 'another note'} instead${r.offsetMs !== null ? `, ${timingWords(r.offsetMs)}` : ''}`;
    case 'missed':
      return `${head}: missed, nothing played there`;
  }
}

/** The slips of a take: every note not hit, in order. */
export const slipsOf = (readings: NoteReading[]) => readings.filter((r) => r.verdict !== 'hit');
