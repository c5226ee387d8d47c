import type { Drill, PlayedNote } from '../types';
import { quarterTempo } from '../patterns/timing';
import { type MidiFile, smfWith, toUnit } from './smf';

/** Velocity of the drill's notes, and of played notes that came without one (MIDI 0-127). */
const DRILL_VELOCITY = 96;
const DEFAULT_VELOCITY = 80;

interface Span {
  midi: number;
  on: number;
  off: number;
  velocity: number;
}

/**
 * Same-pitch notes may not overlap on one channel: a note-off would end both (MIDI 1.0 pairs a
 * note-off with a sounding note of that number, not with a particular note-on). A key bounce or
 * a wind controller's legato on one pitch is cut where the next note of that pitch begins.
 */
function untangle(spans: Span[]): Span[] {
  const byPitch = new Map<number, Span[]>();
  for (const s of spans) {
    const list = byPitch.get(s.midi) ?? [];
    list.push(s);
    byPitch.set(s.midi, list);
  }
  for (const list of byPitch.values()) {
    list.sort((x, y) => x.on - y.on);
    for (let k = 1; k < list.length; k++) {
      const prev = list[k - 1];
      const cur = list[k];
      if (prev.off > cur.on) prev.off = Math.max(prev.on + 1, cur.on);
      cur.on = Math.max(cur.on, prev.off);
      cur.off = Math.max(cur.off, cur.on + 1);
    }
  }
  return spans;
}

/** A named track on `channel` with the spans as notes (program 0, the General MIDI default). */
function addTrack(file: MidiFile, name: string, channel: number, spans: Span[]): void {
  const track = file.addTrack();
  track.name = name;
  track.channel = channel;
  for (const s of untangle(spans)) {
    track.addNote({ midi: s.midi, ticks: s.on, durationTicks: s.off - s.on, velocity: toUnit(s.velocity) });
  }
}

/**
 * A take as a Standard MIDI File (format 1): a conductor track with the drill's tempo and
 * meter, a track named "Drill" with the expected notes and a track named "Take" with the notes
 * as played (their real times and velocities). Time 0 is the first downbeat; a note played
 * before it is placed at 0.
 *
 * @example
 * const bytes = takeToMidi({ drill, played: [{ midi: 65, timeMs: -12, velocity: 70 }] });
 * // three tracks: the conductor, "Drill", "Take" (whose note starts at tick 0)
 */
export function takeToMidi(take: { drill: Drill; played: PlayedNote[] }): Uint8Array {
  const { drill, played } = take;
  const { tempo, meter } = drill.spec;
  // the tempo counts the meter's beat (a dotted quarter in 6/8): the file counts quarters
  const bpm = quarterTempo(tempo, meter);
  const file = smfWith('Sixfold take', bpm, meter);
  const ppq = file.header.ppq;
  const ticksPerMs = (bpm / 60000) * ppq;
  // a played note with no recorded length sounds for a sixteenth
  const defaultTicks = ppq / 4;
  const drillSpans: Span[] = drill.notes
    .filter((n) => n.midi >= 0 && n.midi <= 127)
    .map((n) => {
      const on = Math.max(0, Math.round(n.beat * ppq));
      return {
        midi: n.midi,
        on,
        off: Math.max(on + 1, Math.round((n.beat + n.duration) * ppq)),
        velocity: DRILL_VELOCITY,
      };
    });
  const takeSpans: Span[] = [];
  for (const p of played) {
    const midi = Math.round(p.midi);
    if (!Number.isFinite(p.timeMs) || !(midi >= 0 && midi <= 127)) continue;
    const on = Math.max(0, Math.round(p.timeMs * ticksPerMs));
    const length =
      p.durationMs !== undefined && Number.isFinite(p.durationMs)
        ? Math.round(p.durationMs * ticksPerMs)
        : defaultTicks;
    // a note-on with velocity 0 would be read as a note-off (MIDI 1.0), so 1 is the floor
    const velocity = Math.min(127, Math.max(1, Math.round(p.velocity ?? DEFAULT_VELOCITY)));
    takeSpans.push({ midi, on, off: on + Math.max(1, length), velocity });
  }
  // at one tick the package writes a note's note-off before a later note's note-on, so a
  // repeated pitch is not cut short
  addTrack(file, 'Drill', 0, drillSpans);
  addTrack(file, 'Take', 1, takeSpans);
  return file.toArray();
}
