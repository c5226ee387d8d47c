import { Note } from 'tonal';
import { instruments } from '../instruments';
import type { Drill, DrillNote } from '../types';

/** Divisions per quarter note: eighths (6), triplet eighths (4) and sixteenths (3) are whole. */
const DIVISIONS = 12;

const ACCIDENTAL: Record<number, string> = {
  [-2]: 'flat-flat',
  [-1]: 'flat',
  0: 'natural',
  1: 'sharp',
  2: 'double-sharp',
};

/** type, dots and whether the length is a triplet, by length in divisions. */
const LENGTHS: Record<number, [string, number, boolean]> = {
  48: ['whole', 0, false],
  36: ['half', 1, false],
  24: ['half', 0, false],
  18: ['quarter', 1, false],
  12: ['quarter', 0, false],
  9: ['eighth', 1, false],
  8: ['quarter', 0, true],
  6: ['eighth', 0, false],
  4: ['eighth', 0, true],
  3: ['16th', 0, false],
  2: ['16th', 0, true],
  1: ['32nd', 0, true],
};

function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** <type> and <dot>s, then what goes after the accidental (a triplet's time-modification). */
function lengthXml(d: number): [string, string] {
  const [type, dots, triplet] = LENGTHS[d] ?? ['eighth', 0, false];
  const tuplet = triplet
    ? '<time-modification><actual-notes>3</actual-notes><normal-notes>2</normal-notes></time-modification>'
    : '';
  return [`<type>${type}</type>${'<dot/>'.repeat(dots)}`, tuplet];
}

/** Splits a length into pieces LENGTHS can name, longest first. */
function pieces(d: number): number[] {
  const out: number[] = [];
  const sizes = Object.keys(LENGTHS)
    .map(Number)
    .sort((x, y) => y - x);
  let left = d;
  while (left > 0) {
    const s = sizes.find((x) => x <= left) ?? left;
    out.push(s);
    left -= s;
  }
  return out;
}

function restXml(d: number): string {
  return pieces(d)
    .map((p) => `<note><rest/><duration>${p}</duration><voice>1</voice>${lengthXml(p).join('')}</note>`)
    .join('');
}

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

function pitchOf(n: DrillNote): { step: string; alter: number; octave: number } {
  const p = Note.get(n.written);
  return { step: p.letter, alter: p.alt, octave: p.oct ?? 4 };
}

/**
 * A drill as MusicXML 4.0 (partwise), in written pitch for its instrument, with an accidental on
 * every altered note (no key signature) and a clef that suits the instrument.
 *
 * @example
 * drillToMusicXml(generateDrill({ pair: ['B', 'C'], pattern: 'weave', direction: 'up', instrument: 'alto-sax' }))
 * // '<?xml version="1.0" ...><score-partwise version="4.0">...'
 */
export function drillToMusicXml(drill: Drill): string {
  const { meter, tempo, instrument } = drill.spec;
  const inst = instruments[instrument];
  const measureDivs = Math.round((meter[0] * 4 * DIVISIONS) / meter[1]);
  const heights = drill.notes.map((n) => n.midi - inst.transposition).sort((x, y) => x - y);
  const median = heights.length ? heights[Math.floor(heights.length / 2)] : 60;
  const bass = inst.clef === 'bass' || (instrument === 'piano' && median < 57);
  const clef = bass ? '<clef><sign>F</sign><line>4</line></clef>' : '<clef><sign>G</sign><line>2</line></clef>';

  const byMeasure: string[][] = Array.from({ length: drill.measures }, () => []);
  const filled = new Array<number>(drill.measures).fill(0);
  const altered = Array.from({ length: drill.measures }, () => new Map<string, number>());
  // A slice keeps its measure numbers: number the written measures from its first one.
  const first = drill.notes[0];
  const numberBase = first ? first.measure - Math.floor(Math.round(first.beat * DIVISIONS) / measureDivs) : 1;
  for (const n of drill.notes) {
    const startDiv = Math.round(n.beat * DIVISIONS);
    let at = startDiv;
    let left = Math.round(n.duration * DIVISIONS);
    const { step, alter, octave } = pitchOf(n);
    const segments: [number, number][] = [];
    while (left > 0) {
      const m = Math.floor(at / measureDivs);
      const room = (m + 1) * measureDivs - at;
      const len = Math.min(room, left);
      segments.push([m, len]);
      at += len;
      left -= len;
    }
    segments.forEach(([m, len], i) => {
      if (m >= byMeasure.length) return;
      const seen = altered[m].get(step + octave);
      const showAcc = alter !== 0 || (seen !== undefined && seen !== 0);
      altered[m].set(step + octave, alter);
      const acc = showAcc && i === 0 ? `<accidental>${ACCIDENTAL[alter]}</accidental>` : '';
      const tieStart = i < segments.length - 1;
      const tieStop = i > 0;
      const ties = `${tieStop ? '<tie type="stop"/>' : ''}${tieStart ? '<tie type="start"/>' : ''}`;
      const tied = `${tieStop ? '<tied type="stop"/>' : ''}${tieStart ? '<tied type="start"/>' : ''}`;
      const alterXml = alter !== 0 ? `<alter>${alter}</alter>` : '';
      const [typeXml, tupletXml] = lengthXml(len);
      byMeasure[m].push(
        `<note><pitch><step>${step}</step>${alterXml}<octave>${octave}</octave></pitch>` +
          `<duration>${len}</duration>${ties}<voice>1</voice>${typeXml}${acc}${tupletXml}` +
          (tied ? `<notations>${tied}</notations>` : '') +
          '</note>',
      );
      filled[m] += len;
    });
  }
  const measures = byMeasure.map((notes, i) => {
    let attrs = '';
    if (i === 0) {
      attrs =
        `<attributes><divisions>${DIVISIONS}</divisions><key><fifths>0</fifths></key>` +
        `<time><beats>${meter[0]}</beats><beat-type>${meter[1]}</beat-type></time>${clef}` +
        `${transposeXml(inst.transposition)}</attributes>` +
        `<direction placement="above"><direction-type><metronome><beat-unit>quarter</beat-unit>` +
        `<per-minute>${tempo}</per-minute></metronome></direction-type><sound tempo="${tempo}"/></direction>`;
    }
    const rest = measureDivs - filled[i] > 0 ? restXml(measureDivs - filled[i]) : '';
    return `<measure number="${numberBase + i}">${attrs}${notes.join('')}${rest}</measure>`;
  });

  const title = `${drill.spec.pair[0]}/${drill.spec.pair[1]}`;
  return (
    '<?xml version="1.0" encoding="UTF-8" standalone="no"?>\n' +
    '<!DOCTYPE score-partwise PUBLIC "-//Recordare//DTD MusicXML 4.0 Partwise//EN" "http://www.musicxml.org/dtds/partwise.dtd">\n' +
    '<score-partwise version="4.0">' +
    `<work><work-title>${escapeXml(title)}</work-title></work>` +
    `<identification><encoding><software>Sixfold</software></encoding></identification>` +
    `<part-list><score-part id="P1"><part-name>${escapeXml(inst.label)}</part-name></score-part></part-list>` +
    `<part id="P1">${measures.join('')}</part>` +
    '</score-partwise>\n'
  );
}
