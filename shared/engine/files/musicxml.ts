import { Chord, Note } from 'tonal';
import { instruments } from '../instruments';
import { notate } from '../notation/notate';
import { isCompound, quarterTempo } from '../patterns/timing';
import type { Clef, Drill, NotatedEvent, NotatedMeasure, Notation } from '../types';
import { escapeXml } from './xml-text';

/** Divisions per quarter note: eighths (12), triplet eighths (8), sixteenths (6) and 32nds (3) are whole. */
const DIVISIONS = 24;

const ACCIDENTAL: Record<NonNullable<NotatedEvent['accidental']>, string> = {
  '#': 'sharp',
  b: 'flat',
  n: 'natural',
};

/** MusicXML 4.0 <type> and dots by length in divisions, outside a tuplet and inside one. */
const PLAIN: Record<number, [string, number]> = {
  96: ['whole', 0],
  72: ['half', 1],
  48: ['half', 0],
  36: ['quarter', 1],
  24: ['quarter', 0],
  18: ['eighth', 1],
  12: ['eighth', 0],
  9: ['16th', 1],
  6: ['16th', 0],
  3: ['32nd', 0],
};
const IN_TRIPLET: Record<number, [string, number]> = {
  16: ['quarter', 0],
  8: ['eighth', 0],
  4: ['16th', 0],
  2: ['32nd', 0],
};

/** MusicXML 4.0 clef signs. */
const CLEF_XML: Record<Clef, string> = {
  treble: '<sign>G</sign><line>2</line>',
  // read an octave below what is written (the guitar's clef)
  'treble-8vb': '<sign>G</sign><line>2</line><clef-octave-change>-1</clef-octave-change>',
  bass: '<sign>F</sign><line>4</line>',
};

/** MusicXML <transpose>: written to sounding, as diatonic steps, semitones and octaves. */
function transposeXml(semitones: number): string {
  if (semitones === 0) return '';
  const octaves = Math.trunc(semitones / 12);
  const chromatic = semitones - octaves * 12;
  const steps = [0, 1, 1, 2, 2, 3, 3, 4, 5, 5, 6, 6];
  const diatonic = Math.sign(chromatic) * steps[Math.abs(chromatic)];
  const oct = octaves !== 0 ? `<octave-change>${octaves}</octave-change>` : '';
  return `<transpose><diatonic>${diatonic}</diatonic><chromatic>${chromatic}</chromatic>${oct}</transpose>`;
}

/** A chord symbol as <harmony> (MusicXML 4.0 kind values), with our own symbol as its text. */
function harmonyXml(symbol: string, offset: number, staff: string): string {
  const [tonic, suffix, bass] = Chord.tokenize(symbol);
  const root = Note.get(tonic);
  if (!tonic || root.empty) return '';
  const ivs = new Set(
    Chord.get(symbol).intervals.map((i) => i.replace(/^(\d+)/, (d) => String(((Number(d) - 1) % 7) + 1))),
  );
  const has = (...xs: string[]) => xs.every((x) => ivs.has(x));
  let kind = 'other';
  if (has('3M', '7m')) kind = 'dominant';
  else if (has('3M', '7M')) kind = 'major-seventh';
  else if (has('3m', '5d', '7m')) kind = 'half-diminished';
  else if (has('3m', '7m')) kind = 'minor-seventh';
  else if (has('3m', '7d') || has('3m', '5d', '6M')) kind = 'diminished-seventh';
  else if (has('3m', '7M')) kind = 'major-minor';
  else if (has('3M', '6M')) kind = 'major-sixth';
  else if (has('3m', '6M')) kind = 'minor-sixth';
  else if (has('3m', '5d')) kind = 'diminished';
  else if (has('3M', '5A')) kind = 'augmented';
  else if (has('3m')) kind = 'minor';
  else if (has('3M')) kind = 'major';
  else if (has('4P', '7m')) kind = 'dominant';
  else if (has('4P')) kind = 'suspended-fourth';
  const alter = (n: ReturnType<typeof Note.get>, tag: string) =>
    n.alt !== 0 ? `<${tag}-alter>${n.alt}</${tag}-alter>` : '';
  const bassNote = bass ? Note.get(bass) : null;
  const bassXml =
    bassNote && !bassNote.empty
      ? `<bass><bass-step>${bassNote.letter}</bass-step>${alter(bassNote, 'bass')}</bass>`
      : '';
  const offsetXml = offset > 0 ? `<offset>${offset}</offset>` : '';
  return (
    `<harmony><root><root-step>${root.letter}</root-step>${alter(root, 'root')}</root>` +
    `<kind text="${escapeXml(suffix)}">${kind}</kind>${bassXml}${offsetXml}${staff}</harmony>`
  );
}

function lengthXml(e: NotatedEvent, divs: number): string {
  const [type, dots] = (e.tuplet !== undefined ? IN_TRIPLET[divs] : PLAIN[divs]) ?? PLAIN[divs] ?? ['eighth', 0];
  return `<type>${type}</type>${'<dot/>'.repeat(dots)}`;
}

interface StaffState {
  ottava: number;
}

/** MusicXML 4.0 octave-shift size: 8 for one octave, 15 for two. */
const shiftSize = (ottava: number): number => (Math.abs(ottava) === 15 ? 15 : 8);

/**
 * One staff's events in a measure as <note>s, with the beams, tuplets, stems, accidentals and
 * octave-shift directions notate() decided.
 */
function staffXml(
  events: NotatedEvent[],
  staffIndex: number,
  staves: number,
  barDivs: number,
  state: StaffState,
  isLastOfStaff: (e: NotatedEvent) => boolean,
  before: (e: NotatedEvent) => string,
): string {
  const staffTag = staves > 1 ? `<staff>${staffIndex + 1}</staff>` : '';
  const voice = staffIndex + 1;
  const out: string[] = [];
  const beamMembers = new Map<number, NotatedEvent[]>();
  const tupletMembers = new Map<number, NotatedEvent[]>();
  for (const e of events) {
    if (e.beam !== undefined) beamMembers.set(e.beam, [...(beamMembers.get(e.beam) ?? []), e]);
    if (e.tuplet !== undefined) tupletMembers.set(e.tuplet, [...(tupletMembers.get(e.tuplet) ?? []), e]);
  }
  for (const e of events) {
    out.push(before(e));
    if (e.ottava !== state.ottava && e.ottava !== 0) {
      // MusicXML 4.0: type "down" for an 8va or 15ma line (shown one or two octaves below the
      // pitch), "up" for 8vb or 15mb; size 8 or 15. <pitch> stays the note as written.
      out.push(
        `<direction><direction-type><octave-shift type="${e.ottava > 0 ? 'down' : 'up'}" size="${shiftSize(e.ottava)}" number="${voice}"/>` +
          `</direction-type>${staffTag}</direction>`,
      );
      state.ottava = e.ottava;
    }
    const divs = Math.round(e.duration * DIVISIONS);
    const wholeBar = e.kind === 'rest' && divs === barDivs && e.start === 0;
    let body: string;
    if (e.kind === 'rest') {
      body = `${wholeBar ? '<rest measure="yes"/>' : '<rest/>'}<duration>${divs}</duration><voice>${voice}</voice>`;
      if (!wholeBar) body += lengthXml(e, divs);
    } else {
      const p = Note.get(e.written ?? 'C4');
      const alter = p.alt !== 0 ? `<alter>${p.alt}</alter>` : '';
      body =
        `<pitch><step>${p.letter}</step>${alter}<octave>${p.oct ?? 4}</octave></pitch>` +
        `<duration>${divs}</duration><voice>${voice}</voice>${lengthXml(e, divs)}` +
        (e.accidental ? `<accidental>${ACCIDENTAL[e.accidental]}</accidental>` : '');
    }
    if (e.tuplet !== undefined) {
      body += '<time-modification><actual-notes>3</actual-notes><normal-notes>2</normal-notes></time-modification>';
    }
    if (e.kind === 'note' && e.stem) body += `<stem>${e.stem}</stem>`;
    body += staffTag;
    if (e.beam !== undefined) {
      const group = beamMembers.get(e.beam) ?? [];
      const i = group.indexOf(e);
      const value = i === 0 ? 'begin' : i === group.length - 1 ? 'end' : 'continue';
      body += `<beam number="1">${value}</beam>`;
      if (group.every((g) => Math.round(g.duration * DIVISIONS) <= DIVISIONS / 4)) {
        body += `<beam number="2">${value}</beam>`;
      }
    }
    if (e.tuplet !== undefined) {
      const group = tupletMembers.get(e.tuplet) ?? [];
      const i = group.indexOf(e);
      if (i === 0) {
        body += `<notations><tuplet type="start" number="1" bracket="yes" show-number="actual"/></notations>`;
      } else if (i === group.length - 1) {
        body += '<notations><tuplet type="stop" number="1"/></notations>';
      }
    }
    out.push(`<note>${body}</note>`);
    if (state.ottava !== 0 && isLastOfStaff(e)) {
      out.push(
        `<direction><direction-type><octave-shift type="stop" size="${shiftSize(state.ottava)}" number="${voice}"/></direction-type>${staffTag}</direction>`,
      );
      state.ottava = 0;
    }
  }
  return out.join('');
}

function measureXml(
  m: NotatedMeasure,
  notation: Notation,
  barDivs: number,
  states: StaffState[],
  endsOttava: Set<NotatedEvent>,
  head: string,
  last: boolean,
): string {
  const parts: string[] = [head];
  const chords = m.chords ?? (m.chord ? [{ start: 0, chord: m.chord }] : []);
  notation.staves.forEach((_, s) => {
    if (s > 0) parts.push(`<backup><duration>${barDivs}</duration></backup>`);
    const events = m.events.filter((e) => e.staff === s).sort((x, y) => x.start - y.start);
    // chord symbols go over the top staff, each just before the note or rest it starts on
    const before = (e: NotatedEvent) =>
      s > 0
        ? ''
        : chords
            .filter((c) => c.start >= e.start - 1e-9 && c.start < e.start + e.duration - 1e-9)
            .map((c) => harmonyXml(c.chord, Math.round((c.start - e.start) * DIVISIONS), ''))
            .join('');
    parts.push(staffXml(events, s, notation.staves.length, barDivs, states[s], (e) => endsOttava.has(e), before));
  });
  if (last) parts.push('<barline location="right"><bar-style>light-heavy</bar-style></barline>');
  return `<measure number="${m.number}">${parts.join('')}</measure>`;
}

/**
 * A drill as MusicXML 4.0 (partwise), drawn from notate(drill) so the file shows what the screen
 * and the printed pages show: the same staves and clefs (a grand staff is two staves in one
 * part), written pitch with the same printed accidentals (no key signature), <beam>s for every
 * beam group, <tuplet> brackets with the "3" beside <time-modification>, <octave-shift> for
 * ottava lines, a <score-instrument> and <midi-instrument> for the part, a <metronome> in the
 * meter's beat (a dotted quarter in 6/8, 9/8 and 12/8), chord symbols as <harmony> over a
 * progression, and a final light-heavy barline.
 *
 * @example
 * drillToMusicXml(generateDrill({ pair: ['B', 'A'], pattern: 'weave', direction: 'up', instrument: 'alto-sax' }))
 * // '<?xml version="1.0" ...><score-partwise version="4.0">...'
 */
export function drillToMusicXml(drill: Drill): string {
  const { meter, tempo, instrument } = drill.spec;
  const inst = instruments[instrument];
  const notation = notate(drill);
  const barDivs = Math.round((meter[0] * 4 * DIVISIONS) / meter[1]);
  const staves = notation.staves.length;

  // the last event of each ottava passage, per staff, across bar lines
  const endsOttava = new Set<NotatedEvent>();
  notation.staves.forEach((_, s) => {
    const seq = notation.measures.flatMap((m) =>
      m.events.filter((e) => e.staff === s).sort((x, y) => x.start - y.start),
    );
    seq.forEach((e, i) => {
      if (e.ottava !== 0 && (i === seq.length - 1 || seq[i + 1].ottava !== e.ottava)) endsOttava.add(e);
    });
  });

  const clefs = notation.staves
    .map((c, i) => `<clef${staves > 1 ? ` number="${i + 1}"` : ''}>${CLEF_XML[c]}</clef>`)
    .join('');
  const compound = isCompound(meter);
  const beatUnit = compound ? '<beat-unit>quarter</beat-unit><beat-unit-dot/>' : '<beat-unit>quarter</beat-unit>';
  const attributes =
    `<attributes><divisions>${DIVISIONS}</divisions><key><fifths>0</fifths></key>` +
    `<time><beats>${meter[0]}</beats><beat-type>${meter[1]}</beat-type></time>` +
    (staves > 1 ? `<staves>${staves}</staves>` : '') +
    `${clefs}${transposeXml(inst.transposition)}</attributes>` +
    `<direction placement="above"><direction-type><metronome>${beatUnit}<per-minute>${tempo}</per-minute></metronome>` +
    `</direction-type>${staves > 1 ? '<staff>1</staff>' : ''}<sound tempo="${+quarterTempo(tempo, meter).toFixed(3)}"/></direction>`;

  const states: StaffState[] = notation.staves.map(() => ({ ottava: 0 }));
  const measures = notation.measures.map((m, i) =>
    measureXml(m, notation, barDivs, states, endsOttava, i === 0 ? attributes : '', i === notation.measures.length - 1),
  );

  const title = `${drill.spec.pair[0]}/${drill.spec.pair[1]}`;
  const label = escapeXml(inst.label);
  return (
    '<?xml version="1.0" encoding="UTF-8" standalone="no"?>\n' +
    '<!DOCTYPE score-partwise PUBLIC "-//Recordare//DTD MusicXML 4.0 Partwise//EN" "http://www.musicxml.org/dtds/partwise.dtd">\n' +
    '<score-partwise version="4.0">' +
    `<work><work-title>${escapeXml(title)}</work-title></work>` +
    '<identification><encoding><software>Sixfold</software></encoding></identification>' +
    `<part-list><score-part id="P1"><part-name>${label}</part-name>` +
    `<score-instrument id="P1-I1"><instrument-name>${label}</instrument-name></score-instrument>` +
    // MusicXML 4.0: midi-program is 1-based (General MIDI program + 1)
    `<midi-instrument id="P1-I1"><midi-channel>1</midi-channel><midi-program>${inst.program + 1}</midi-program></midi-instrument>` +
    '</score-part></part-list>' +
    `<part id="P1">${measures.join('')}</part>` +
    '</score-partwise>\n'
  );
}
