import { instruments } from '../instruments';
import { beatGroups, isCompound, measureLength } from '../patterns/timing';
import type { Clef, Drill, Meter, NotatedEvent, NotatedMeasure, Notation, Ottava } from '../types';
import { diatonicStep, ledgerLines, middleLine, ottavaOctaves, staffNote } from './staff-position';

/** Ticks per quarter note: eighths (12), triplet eighths (8), sixteenths (6), 32nds (3) are whole. */
const TPQ = 24;
const TRIPLET_EIGHTH = TPQ / 3;
/** Most ledger lines a note may need before it goes under an ottava line (common practice). */
const MAX_LEDGER = 4;

interface Placed {
  noteIndex: number;
  /** 0-based measure slot */
  slot: number;
  staff: number;
  start: number;
  length: number;
  written: string;
  step: number;
}

interface Beat {
  start: number;
  length: number;
}

const toTicks = (quarters: number): number => Math.round(quarters * TPQ);

/**
 * The one notation model of a drill, in written pitch for its instrument: staves and clefs,
 * ottava lines, printed accidentals, beam groups, tuplets, rests, measure numbers and chord
 * symbols. The staff on screen, the printed pages and MusicXML all draw from it.
 *
 * Rules (common practice for printed exercises): piano reads a grand staff with notes below
 * middle C on the bass staff; no note sits more than four ledger lines from its staff (an
 * 8va or 8vb line takes it back, a 15ma or 15mb line where one octave is not enough, as for
 * the piano's B7 and C8); an accidental holds to the
 * end of its bar on its staff and printed octave; beams group notes shorter than a quarter
 * within one beat and a triplet is one tuplet of three under one beam; rests sit on the beat
 * and fill every bar exactly, on every staff (a staff with nothing in a bar gets one rest as
 * long as the bar, drawn as a whole-bar rest). Events are sorted by start, then staff.
 *
 * @example
 * const n = notate(generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 65 }));
 * n.staves // ['treble', 'bass']
 * n.measures[0].events.filter((e) => e.staff === 0 && e.kind === 'note').length // 12
 */
export function notate(drill: Drill): Notation {
  const inst = instruments[drill.spec.instrument];
  const staves: Clef[] = inst.clef === 'grand' ? ['treble', 'bass'] : [inst.clef];
  const meter = drill.spec.meter;
  const barLength = measureLength(meter);
  const barTicks = toTicks(barLength);
  const beats = beatsOf(meter);
  const count = Math.max(1, drill.measures);

  // A slice keeps its measure numbers: number the bars from its first note's.
  const first = drill.notes[0];
  const base = first ? first.measure - Math.floor(first.beat / barLength + 1e-9) : 1;

  const placed: Placed[] = drill.notes.map((n, noteIndex) => {
    const slot = n.measure - base;
    const midiWritten = staffNote(n.written).midi ?? n.midi;
    const staff = staves.length === 2 && midiWritten < 60 ? 1 : 0;
    return {
      noteIndex,
      slot,
      staff,
      start: toTicks(n.beat) - slot * barTicks,
      length: toTicks(n.duration),
      written: n.written,
      step: diatonicStep(n.written),
    };
  });

  const ottavas = new Map<number, Ottava>();
  staves.forEach((clef, staff) => {
    const onStaff = placed.filter((p) => p.staff === staff);
    const shifts = ottavaShifts(
      onStaff.map((p) => p.step),
      clef,
    );
    onStaff.forEach((p, i) => {
      ottavas.set(p.noteIndex, shifts[i]);
    });
  });

  const changes = readChanges(drill);
  const measures: NotatedMeasure[] = [];
  for (let slot = 0; slot < count; slot++) {
    const number = base + slot;
    const events: NotatedEvent[] = [];
    const ids = { beam: 0, tuplet: 0 };
    staves.forEach((clef, staff) => {
      const notes = placed.filter((p) => p.slot === slot && p.staff === staff).sort((x, y) => x.start - y.start);
      events.push(...staffBar(notes, staff, clef, meter, beats, barTicks, ottavas, ids));
    });
    events.sort((x, y) => x.start - y.start || x.staff - y.staff);
    const measure: NotatedMeasure = { number, events };
    if (changes.length > 0) {
      // changes count beats from the drill's own start, as its notes do (a slice re-bases both)
      const from = slot * barLength;
      const to = from + barLength;
      const at = changes.find((c) => c.startBeat <= from + 1e-9 && from < c.startBeat + c.beats - 1e-9);
      const starting = changes.filter((c) => c.startBeat >= from - 1e-9 && c.startBeat < to - 1e-9);
      const chord = at ?? starting[0];
      if (chord) measure.chord = chord.chord;
      if (starting.length > 0) {
        measure.chords = starting.map((c) => ({ start: toTicks(c.startBeat - from) / TPQ, chord: c.chord }));
      }
    }
    measures.push(measure);
  }
  inheritOttavaOnRests(measures, staves.length);
  return { staves, measures };
}

interface Change {
  chord: string;
  startBeat: number;
  beats: number;
}

/** The drill's progression, when it has one (read defensively: older drills have none). */
function readChanges(drill: Drill): Change[] {
  const raw = (drill as { changes?: unknown }).changes;
  if (!Array.isArray(raw)) return [];
  return raw.filter(
    (c): c is Change =>
      !!c &&
      typeof c.chord === 'string' &&
      typeof c.startBeat === 'number' &&
      typeof c.beats === 'number' &&
      Number.isFinite(c.startBeat) &&
      Number.isFinite(c.beats),
  );
}

/** The meter's beats in ticks. */
function beatsOf(meter: Meter): Beat[] {
  const out: Beat[] = [];
  let at = 0;
  for (const q of beatGroups(meter)) {
    const length = toTicks(q);
    out.push({ start: at, length });
    at += length;
  }
  return out;
}

/**
 * Which whole empty beats one rest may cover, from each beat: in 4/4 beats 1-2 and 3-4 (a half
 * rest starts on 1 or 3), in 12/8 likewise by dotted quarters; 3/4 and 9/8 may join beats 1-2;
 * 5/4 beats 1-2 and 4-5; 5/8 and 7/8 keep each beat (common practice).
 */
function mergeableFrom(beats: Beat[], meter: Meter): (i: number) => boolean {
  const even = beats.every((b) => b.length === beats[0].length);
  if (!even || beats.length < 3) return () => false;
  const compound = isCompound(meter);
  if (compound && beats.length === 3) return (i) => i === 0;
  // 5/4 is felt 3+2: a half rest on 1 or on 4, never across beat 3's group
  if (beats.length === 5) return (i) => i === 0 || i === 3;
  return (i) => i % 2 === 0 && i + 1 < beats.length;
}

/**
 * One staff's bar: its notes with rests filling every gap, beams, tuplets, stems and the
 * accidentals printed. `ids` counts beams and tuplets through the measure, so ids are unique in it.
 */
function staffBar(
  notes: Placed[],
  staff: number,
  clef: Clef,
  meter: Meter,
  beats: Beat[],
  barTicks: number,
  ottavas: Map<number, Ottava>,
  ids: { beam: number; tuplet: number },
): NotatedEvent[] {
  const events: NotatedEvent[] = [];

  // Rests first: each beat with no note at all is an empty beat; a beat with notes has its gaps
  // filled inside it.
  const emptyBeats: boolean[] = beats.map(
    (b) => !notes.some((n) => n.start < b.start + b.length && n.start + n.length > b.start),
  );
  const allEmpty = emptyBeats.every(Boolean);
  if (allEmpty) {
    events.push(rest(staff, 0, barTicks, null));
    return events;
  }

  for (let bi = 0; bi < beats.length; bi++) {
    const b = beats[bi];
    if (emptyBeats[bi]) continue;
    const inBeat = notes.filter((n) => n.start >= b.start && n.start < b.start + b.length);
    const triplet = inBeat.some((n) => n.length % TRIPLET_EIGHTH === 0 && n.length % (TPQ / 2) !== 0);
    const tuplet = triplet ? ++ids.tuplet : undefined;
    // gaps inside the beat
    let at = b.start;
    const beatEnd = b.start + b.length;
    const covered = notes
      .filter((n) => n.start < beatEnd && n.start + n.length > b.start)
      .map((n) => [Math.max(n.start, b.start), Math.min(n.start + n.length, beatEnd)] as const)
      .sort((x, y) => x[0] - y[0]);
    const pieces: NotatedEvent[] = [];
    for (const [s, e] of covered) {
      if (s > at) pieces.push(...restPieces(staff, at, s, b, triplet, tuplet));
      at = Math.max(at, e);
    }
    if (at < beatEnd) pieces.push(...restPieces(staff, at, beatEnd, b, triplet, tuplet));
    for (const n of inBeat) {
      const e: NotatedEvent = {
        kind: 'note',
        staff,
        start: n.start / TPQ,
        duration: n.length / TPQ,
        noteIndex: n.noteIndex,
        written: n.written,
        accidental: null,
        ottava: ottavas.get(n.noteIndex) ?? 0,
      };
      if (tuplet !== undefined && n.length === TRIPLET_EIGHTH) e.tuplet = tuplet;
      pieces.push(e);
    }
    pieces.sort((x, y) => x.start - y.start);
    // beams: runs of consecutive notes shorter than a quarter, two or more, inside this beat
    let run: NotatedEvent[] = [];
    const closeRun = () => {
      if (run.length >= 2) {
        const id = ++ids.beam;
        for (const e of run) e.beam = id;
      }
      run = [];
    };
    let runEnd = -1;
    for (const e of pieces) {
      const beamable = e.kind === 'note' && toTicks(e.duration) < TPQ && toTicks(e.start + e.duration) <= beatEnd;
      if (!beamable || (run.length > 0 && toTicks(e.start) !== runEnd)) closeRun();
      if (beamable) {
        run.push(e);
        runEnd = toTicks(e.start + e.duration);
      }
    }
    closeRun();
    events.push(...pieces);
  }

  // whole empty beats: joined where the meter groups them, else one rest a beat
  const mergeable = mergeableFrom(beats, meter);
  for (let bi = 0; bi < beats.length; bi++) {
    if (!emptyBeats[bi]) continue;
    const b = beats[bi];
    if (mergeable(bi) && emptyBeats[bi + 1]) {
      events.push(rest(staff, b.start, b.length + beats[bi + 1].length, null));
      bi++;
    } else {
      events.push(rest(staff, b.start, b.length, null));
    }
  }
  events.sort((x, y) => x.start - y.start);
  setStems(events, clef, notes);
  printAccidentals(events, notes);
  return events;
}

function rest(staff: number, startTicks: number, lengthTicks: number, tuplet: number | null | undefined): NotatedEvent {
  const e: NotatedEvent = {
    kind: 'rest',
    staff,
    start: startTicks / TPQ,
    duration: lengthTicks / TPQ,
    accidental: null,
    ottava: 0,
  };
  if (tuplet) e.tuplet = tuplet;
  return e;
}

/**
 * Rests for a gap inside a beat that holds notes: triplet eighths in a triplet beat, else the
 * longest of eighth, sixteenth or 32nd that starts on its own grid (a quarter at the start of a
 * dotted-quarter beat).
 */
function restPieces(
  staff: number,
  from: number,
  to: number,
  beat: Beat,
  triplet: boolean,
  tuplet: number | undefined,
): NotatedEvent[] {
  const out: NotatedEvent[] = [];
  let at = from;
  while (at < to) {
    const left = to - at;
    const rel = at - beat.start;
    let size: number;
    if (triplet && left >= TRIPLET_EIGHTH && rel % TRIPLET_EIGHTH === 0) size = TRIPLET_EIGHTH;
    else {
      const sizes = [TPQ, TPQ / 2, TPQ / 4, TPQ / 8].filter(
        (s) => s <= left && rel % s === 0 && (s < TPQ || (rel === 0 && beat.length > TPQ)),
      );
      size = sizes[0] ?? [TPQ / 2, TRIPLET_EIGHTH, TPQ / 4, TPQ / 6, TPQ / 8, 1].find((s) => s <= left) ?? left;
    }
    out.push(rest(staff, at, size, triplet && size === TRIPLET_EIGHTH ? tuplet : undefined));
    at += size;
  }
  return out;
}

/**
 * Stems per beam group (the note farthest from the middle line decides, common practice), and
 * per note for notes outside a group.
 */
function setStems(events: NotatedEvent[], clef: Clef, notes: Placed[]): void {
  const stepOf = new Map(notes.map((n) => [n.noteIndex, n.step]));
  const middle = middleLine(clef);
  const printed = (e: NotatedEvent) => (stepOf.get(e.noteIndex ?? -1) ?? middle) - shiftSteps(e.ottava);
  const groups = new Map<number, NotatedEvent[]>();
  for (const e of events) {
    if (e.kind !== 'note') continue;
    if (e.beam === undefined) {
      e.stem = printed(e) >= middle ? 'down' : 'up';
      continue;
    }
    const g = groups.get(e.beam) ?? [];
    g.push(e);
    groups.set(e.beam, g);
  }
  for (const g of groups.values()) {
    const above = Math.max(...g.map((e) => printed(e) - middle));
    const below = Math.max(...g.map((e) => middle - printed(e)));
    const stem = above >= below ? 'down' : 'up';
    for (const e of g) e.stem = stem;
  }
}

function shiftSteps(ottava: Ottava): number {
  return 7 * ottavaOctaves(ottava);
}

const SIGN: Record<number, '#' | 'b' | 'n'> = { 1: '#', [-1]: 'b', 0: 'n', 2: '#', [-2]: 'b' };

/**
 * Prints an accidental where a note's alteration differs from what the bar has shown for that
 * letter and printed octave (natural before any sign); the sign then holds to the bar's end.
 */
function printAccidentals(events: NotatedEvent[], notes: Placed[]): void {
  const stepOf = new Map(notes.map((n) => [n.noteIndex, n.step]));
  const shown = new Map<number, number>();
  for (const e of events) {
    if (e.kind !== 'note' || e.written === undefined) continue;
    const alt = staffNote(e.written).alt;
    const pos = (stepOf.get(e.noteIndex ?? -1) ?? 0) - shiftSteps(e.ottava);
    const before = shown.get(pos) ?? 0;
    if (alt !== before) {
      e.accidental = SIGN[alt] ?? null;
      shown.set(pos, alt);
    }
  }
}

/**
 * Ottava shifts for one staff's notes in playing order. A note that needs more than four ledger
 * lines goes under an 8va (above) or 8vb (below) line; the line then reaches over neighbours
 * that sit off the staff the same way and still read within four ledger lines, and joins two
 * lines a few notes apart, so it marks a passage rather than a note here and there.
 *
 * Inside such a passage, a note that one octave still leaves more than four ledger lines off
 * (the piano's B7 and C8 on the treble staff) goes under a 15ma (or 15mb) line, and that line
 * runs on to the next such note when every note between reads within four ledger lines two
 * octaves off; the rest of the passage keeps the one-octave line, the smallest shift that
 * serves it (common practice: a two-octave line only where one octave is not enough).
 */
export function ottavaShifts(steps: number[], clef: Clef): Ottava[] {
  // shifts are counted in octaves here: 1 = 8va, 2 = 15ma, negative below the staff
  const fits = (i: number, o: number) => {
    const l = ledgerLines(steps[i] - 7 * o, clef);
    return l <= MAX_LEDGER && l >= -MAX_LEDGER;
  };
  const side = steps.map((s) => {
    const lines = ledgerLines(s, clef);
    return lines > MAX_LEDGER ? 1 : lines < -MAX_LEDGER ? -1 : 0;
  });
  const k: number[] = [...side];
  // reach over neighbours off the staff on the same side
  for (let pass = 0; pass < 2; pass++) {
    for (let i = 0; i < k.length; i++) {
      if (k[i] === 0) continue;
      const o = k[i];
      for (const d of [-1, 1]) {
        let j = i + d;
        while (j >= 0 && j < k.length && k[j] === 0 && Math.sign(ledgerLines(steps[j], clef)) === Math.sign(o)) {
          if (!fits(j, o)) break;
          k[j] = o;
          j += d;
        }
      }
    }
  }
  // join lines of the same direction a few notes apart
  const GAP = 3;
  let lastEnd = -1;
  for (let i = 0; i < k.length; i++) {
    if (k[i] === 0) continue;
    if (lastEnd >= 0 && i - lastEnd - 1 > 0 && i - lastEnd - 1 <= GAP && Math.sign(k[lastEnd]) === Math.sign(k[i])) {
      const o = k[i];
      let ok = true;
      for (let j = lastEnd + 1; j < i; j++) if (!fits(j, o)) ok = false;
      if (ok) for (let j = lastEnd + 1; j < i; j++) k[j] = o;
    }
    lastEnd = i;
  }
  // two octaves where one is not enough, run on between such notes of one passage
  let lastTwice = -1;
  for (let i = 0; i < k.length; i++) {
    if (side[i] === 0 || fits(i, side[i])) continue;
    const o = 2 * side[i];
    k[i] = o;
    if (lastTwice >= 0 && k[lastTwice] === o) {
      const between = Array.from({ length: i - lastTwice - 1 }, (_, x) => lastTwice + 1 + x);
      const inPassage = between.every((j) => Math.sign(k[j]) === side[i] && fits(j, o));
      // a short dip, or notes that all need a line themselves, stay under the one line
      const joins = between.length <= GAP || between.every((j) => side[j] === side[i]);
      if (inPassage && joins) for (const j of between) k[j] = o;
    }
    lastTwice = i;
  }
  return k.map((o): Ottava => (o === 2 ? 15 : o === 1 ? 8 : o === -1 ? -8 : o === -2 ? -15 : 0));
}

/** A rest between two notes under the same ottava line on its staff stays under it. */
function inheritOttavaOnRests(measures: NotatedMeasure[], staffCount: number): void {
  for (let staff = 0; staff < staffCount; staff++) {
    const seq = measures.flatMap((m) => m.events.filter((e) => e.staff === staff));
    // the ottava of the next note after each event, filled from the end
    const nextOttava = new Array<Ottava | null>(seq.length);
    let next: Ottava | null = null;
    for (let i = seq.length - 1; i >= 0; i--) {
      nextOttava[i] = next;
      if (seq[i].kind === 'note') next = seq[i].ottava;
    }
    let prev: Ottava = 0;
    seq.forEach((e, i) => {
      if (e.kind === 'note') prev = e.ottava;
      else if (prev !== 0 && nextOttava[i] === prev) e.ottava = prev;
    });
  }
}
