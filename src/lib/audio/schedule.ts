import { beatGroups, type Drill, isCompound, quarterTempo } from '@shared/engine';
import { chordTones } from '@shared/engine/theory/chord-tones';
import { Note } from 'tonal';

/** One sound to make, in seconds from the start of playback (the count-in included). */
export type AudioEvent =
  | { kind: 'note'; time: number; duration: number; midi: number; velocity: number; index: number }
  | { kind: 'click'; time: number; accent: boolean; countIn: boolean }
  | { kind: 'pad'; time: number; duration: number; midis: number[] };

export interface ScheduleOptions {
  /** a click on every beat of the meter (default on) */
  click?: boolean;
  /** the spec's chord held under each measure, or each chord of a progression for its beats (default off) */
  pad?: boolean;
  /** measures of clicks before the first downbeat (default 1) */
  countInMeasures?: number;
}

export interface Schedule {
  events: AudioEvent[];
  /** where the drill's first downbeat falls */
  downbeat: number;
  /** the end of the last measure */
  end: number;
}

/** The chord's tones voiced upward from the C below middle C, for a pad that sits under the drill. */
export function padVoicing(chord: string): number[] {
  const out: number[] = [];
  let last = 47;
  for (const pc of chordTones(chord)) {
    const chroma = Note.chroma(pc);
    if (chroma === undefined || Number.isNaN(chroma)) continue;
    let m = 48 + chroma;
    while (m <= last) m += 12;
    out.push(m);
    last = m;
  }
  return out;
}

/**
 * Turns a drill into timed sounds: each note at beat x 60 / tempo seconds after the downbeat,
 * a click on each beat of the meter (accented on the measure's first), a count-in before it,
 * and the chord pad once per measure. Pure, so tests read it without any audio hardware.
 *
 * @example
 * scheduleDrill(drill, { countInMeasures: 0 }).events.find((e) => e.kind === 'note')?.time // 0
 */
export function scheduleDrill(drill: Drill, opts: ScheduleOptions = {}): Schedule {
  const { tempo, meter, chord } = drill.spec;
  const click = opts.click ?? true;
  const countIn = Math.max(0, Math.floor(opts.countInMeasures ?? 1));
  // The tempo counts the meter's beat: a dotted quarter in 6/8, 9/8 and 12/8.
  const secPerQuarter = 60 / quarterTempo(tempo, meter);
  const measureQuarters = meter[0] * (4 / meter[1]);
  // Clicks fall on the meter's beats: each dotted quarter in a compound meter, else each unit.
  const clickBeats = isCompound(meter) ? beatGroups(meter) : Array.from({ length: meter[0] }, () => 4 / meter[1]);
  const downbeat = countIn * measureQuarters * secPerQuarter;
  const end = downbeat + drill.measures * measureQuarters * secPerQuarter;
  const events: AudioEvent[] = [];

  const clicks = click ? countIn + drill.measures : countIn;
  for (let m = 0; m < clicks; m++) {
    let at = 0;
    clickBeats.forEach((length, b) => {
      const time = (m * measureQuarters + at) * secPerQuarter;
      events.push({ kind: 'click', time, accent: b === 0, countIn: m < countIn });
      at += length;
    });
  }
  // over a progression the pad follows the changes: each chord held for its own beats
  if (opts.pad && drill.changes) {
    for (const c of drill.changes) {
      const midis = padVoicing(c.chord);
      if (midis.length === 0) continue;
      events.push({
        kind: 'pad',
        time: downbeat + c.startBeat * secPerQuarter,
        duration: c.beats * secPerQuarter * 0.95,
        midis,
      });
    }
  }
  const voicing = opts.pad && chord && !drill.changes ? padVoicing(chord) : [];
  if (voicing.length > 0) {
    for (let m = 0; m < drill.measures; m++) {
      events.push({
        kind: 'pad',
        time: downbeat + m * measureQuarters * secPerQuarter,
        duration: measureQuarters * secPerQuarter * 0.95,
        midis: voicing,
      });
    }
  }
  drill.notes.forEach((n, index) => {
    events.push({
      kind: 'note',
      time: downbeat + n.beat * secPerQuarter,
      duration: n.duration * secPerQuarter * 0.85,
      midi: n.midi,
      velocity: 96,
      index,
    });
  });
  events.sort((x, y) => x.time - y.time);
  return { events, downbeat, end };
}
