import fc from 'fast-check';
import { Interval, Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import {
  type DrillNote,
  type InstrumentId,
  allPairs,
  generateDrill,
  inAllKeys,
  instruments,
  parseTriad,
  writtenPair,
} from '../../shared/engine';
import { movePair, semitoneInterval, spellPairAsUnit } from '../../shared/engine/theory/pair-spelling';

const INSTRUMENTS = Object.keys(instruments) as InstrumentId[];
const PAIRS = allPairs();
const doubled = (name: string) => Math.abs(Note.get(name).alt) > 1;
const triadNotes = (pair: [string, string]) => pair.flatMap((s) => parseTriad(s).pitchClasses);

describe('spelling a pair as one unit (the examples of the rule)', () => {
  it.each([
    // written = concert moved by the instrument's interval (alto sax: up a major sixth, from memory)
    [['B', 'A'], 'alto-sax', ['Ab', 'Gb']], // B major on alto is written Ab major
    [['Db', 'Eb'], 'alto-sax', ['Bb', 'C']], // concert Db on alto reads Bb
    [['Em', 'D'], 'alto-sax', ['C#m', 'B']], // concert Em reads C#m, not Dbm
    [['F#', 'E'], 'trumpet', ['Ab', 'Gb']], // F#/E on a B-flat instrument: Ab/Gb, never Ab/F#
    [['F#', 'E'], 'tenor-sax', ['Ab', 'Gb']],
    [['F', 'Eb'], 'piano', ['F', 'Eb']],
  ] as const)('%j on %s reads %j', (concert, instrument, written) => {
    expect(writtenPair([...concert], instrument)).toEqual(written);
  });

  it('names the written pair as the drill writes its notes', () => {
    const d = generateDrill({ pair: ['F#', 'E'], pattern: 'stack', direction: 'up', instrument: 'trumpet' });
    const pcs = writtenPair(['F#', 'E'], 'trumpet').flatMap((s) => parseTriad(s).pitchClasses);
    for (const n of d.notes) expect(pcs).toContain(Note.pitchClass(n.written));
  });

  it('keeps the pair as given on a tie, and a double flat never wins', () => {
    expect(spellPairAsUnit({ a: { root: 'F', quality: 'major' }, b: { root: 'Eb', quality: 'major' } })).toEqual({
      a: { root: 'F', quality: 'major' },
      b: { root: 'Eb', quality: 'major' },
    });
    // Eb with Gbm needs Bbb, its respelling D# with F##m: only then is one triad respelled alone
    expect(movePair(['C', 'Ebm'], '3m')).toEqual(['Eb', 'F#m']);
  });

  it('hands out a fresh answer each time: changing one does not change the next (answers are remembered)', () => {
    const input = () => ({
      a: { root: 'G#', quality: 'major' as const },
      b: { root: 'F#', quality: 'major' as const },
    });
    const first = spellPairAsUnit(input());
    first.a.root = 'X';
    expect(spellPairAsUnit(input())).toEqual({
      a: { root: 'Ab', quality: 'major' },
      b: { root: 'Gb', quality: 'major' },
    });
    // a pair that stays as given is not tied to the caller's object either
    const given = { a: { root: 'F', quality: 'major' as const }, b: { root: 'Eb', quality: 'major' as const } };
    spellPairAsUnit(given);
    given.a.root = 'Y';
    expect(spellPairAsUnit({ a: { root: 'F', quality: 'major' }, b: { root: 'Eb', quality: 'major' } }).a.root).toBe(
      'F',
    );
  });

  it('writes a concert whole step as a whole step (F#3-G#3 on trumpet: Ab3-Bb3; on tenor: Ab4-Bb4)', () => {
    const scale = { name: 'steps', subdivision: 'eighth' as const, source: 'scale' as const, degrees: [0, 1], step: 2 };
    for (const [instrument, want] of [
      ['trumpet', ['Ab3', 'Bb3']],
      ['tenor-sax', ['Ab4', 'Bb4']],
    ] as const) {
      const d = generateDrill({ pair: ['F#', 'E'], pattern: scale, direction: 'up', start: 54, instrument });
      expect(d.notes.slice(0, 2).map((n) => n.name)).toEqual(['F#3', 'G#3']);
      expect(d.notes.slice(0, 2).map((n) => n.written)).toEqual(want);
      // tonal: a major second in both
      expect(Interval.distance(d.notes[0].written, d.notes[1].written)).toBe('2M');
    }
  });

  it('keeps the names the player typed for the drill itself', () => {
    const d = generateDrill({ pair: ['Gb', 'Fb'], pattern: 'stack', direction: 'up', start: 66 });
    expect(d.notes.slice(0, 6).map((n) => Note.pitchClass(n.name))).toEqual(['Gb', 'Bb', 'Db', 'Fb', 'Ab', 'Cb']);
    // the written part follows the rule: Fb would be a root, so the unit reads F#/E
    expect(d.notes.slice(0, 6).map((n) => Note.pitchClass(n.written))).toEqual(['F#', 'A#', 'C#', 'E', 'G#', 'B']);
  });
});

describe('no double sharps or flats in key cycles or written parts', () => {
  it('holds for every pair, in all 12 keys, on every instrument', () => {
    const problems: string[] = [];
    // instruments that move a pair by the same interval (up to octaves) read it the same way
    const byInterval = new Map(INSTRUMENTS.map((id) => [((instruments[id].transposition % 12) + 12) % 12, id]));
    for (const p of PAIRS) {
      const typed: [string, string] = [p.a.symbol, p.b.symbol];
      for (let k = 0; k < 12; k++) {
        // as inAllKeys moves it (the drill's own key keeps the names as typed)
        const concert = k === 0 ? typed : movePair(typed, semitoneInterval(k));
        if (k > 0 && triadNotes(concert).some(doubled)) problems.push(`${typed} +${k}: ${concert}`);
        // tonal: the moved roots sound k semitones up
        if ((Note.chroma(parseTriad(concert[0]).root)! - Note.chroma(p.a.root)! - k) % 12 !== 0) {
          problems.push(`${typed} +${k}: ${concert} is not ${k} semitones up`);
        }
        for (const id of byInterval.values()) {
          const written = writtenPair(concert, id);
          if (triadNotes(written).some(doubled)) problems.push(`${concert} on ${id}: ${written}`);
          // the interval between the roots keeps its name whenever a unit spelling has no double
          const kept = Interval.distance(parseTriad(written[0]).root, parseTriad(written[1]).root);
          const was = Interval.distance(parseTriad(concert[0]).root, parseTriad(concert[1]).root);
          if (kept !== was && !triadNotes(concert).some(doubled)) {
            const shift = semitoneInterval(-instruments[id].transposition);
            const unit = ['1P', '2d', '-2d'].map((d) =>
              concert.map((s) => {
                const t = parseTriad(s);
                const root = Note.transpose(Note.transpose(t.root, shift), d);
                return parseTriad(root + s.slice(t.root.length));
              }),
            );
            const anyClean = unit.some((u) => u.every((t) => !doubled(t.root) && !t.pitchClasses.some(doubled)));
            if (anyClean) problems.push(`${concert} on ${id}: ${written} lost the interval ${was}`);
          }
        }
      }
    }
    expect(problems.slice(0, 10)).toEqual([]);
  });

  it('every note of every moved drill is written without a double sharp or flat, intervals kept (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: PAIRS.length - 1 }),
        fc.integer({ min: 0, max: 11 }),
        fc.constantFrom(...INSTRUMENTS),
        fc.constantFrom('weave' as const, 'four-three' as const, 'scale-steps' as const),
        (i, k, instrument, pattern) => {
          const p = PAIRS[i];
          const pair = movePair([p.a.symbol, p.b.symbol], semitoneInterval(k));
          const d = generateDrill({ pair, pattern, direction: 'up-down', instrument });
          const t = instruments[instrument].transposition;
          const interval = (x: DrillNote, y: DrillNote, key: 'name' | 'written') => Interval.distance(x[key], y[key]);
          const unitKept =
            Interval.distance(parseTriad(pair[0]).root, parseTriad(pair[1]).root) ===
            Interval.distance(
              parseTriad(writtenPair(pair, instrument)[0]).root,
              parseTriad(writtenPair(pair, instrument)[1]).root,
            );
          d.notes.forEach((n, j) => {
            expect(doubled(n.name)).toBe(false);
            expect(doubled(n.written)).toBe(false);
            // MIDI 1.0 numbering, read by tonal: the written name sounds the note once transposed
            expect(Note.midi(n.written)).toBe(n.midi - t);
            if (j > 0 && unitKept)
              expect(interval(d.notes[j - 1], n, 'written')).toBe(interval(d.notes[j - 1], n, 'name'));
          });
        },
      ),
      { numRuns: 200 },
    );
  });

  it('inAllKeys gives the same moved pairs', () => {
    const drills = inAllKeys({ pair: ['Ebdim', 'E'], pattern: 'stack', direction: 'up' });
    drills.slice(1).forEach((d, j) => {
      expect(d.spec.pair).toEqual(movePair(['Ebdim', 'E'], semitoneInterval(j + 1)));
      expect(triadNotes(d.spec.pair).some(doubled)).toBe(false);
    });
  });
});
