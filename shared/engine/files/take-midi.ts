import type { Drill, PlayedNote } from '../types';
import { PPQ, setTempo, smfBytes, type TrackEvent, timeSignature, trackChunk, trackName } from './smf';

/** Velocity of the drill's notes, and of played notes that came without one (MIDI 0-127). */
const DRILL_VELOCITY = 96;
const DEFAULT_VELOCITY = 80;
/** A played note with no recorded length sounds for a sixteenth. */
const DEFAULT_TICKS = PPQ / 4;

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

function noteEvents(spans: Span[], channel: number): TrackEvent[] {
  const events: TrackEvent[] = [];
  for (const s of untangle(spans)) {
    // at one tick, note-offs go before note-ons so a repeated pitch is not cut short
    events.push({ tick: s.on, order: 3, data: [0x90 | channel, s.midi, s.velocity] });
    events.push({ tick: s.off, order: 2, data: [0x80 | channel, s.midi, 0] });
  }
  return events;
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
  const ticksPerMs = (tempo / 60000) * PPQ;
  const conductor = trackChunk([
    { tick: 0, order: 0, data: trackName('Sixfold take') },
    { tick: 0, order: 1, data: timeSignature(meter[0], meter[1]) },
    { tick: 0, order: 2, data: setTempo(tempo) },
  ]);
  const drillSpans: Span[] = drill.notes
    .filter((n) => n.midi >= 0 && n.midi <= 127)
    .map((n) => {
      const on = Math.max(0, Math.round(n.beat * PPQ));
      return { midi: n.midi, on, off: Math.max(on + 1, Math.round((n.beat + n.duration) * PPQ)), velocity: DRILL_VELOCITY };
    });
  const takeSpans: Span[] = [];
  for (const p of played) {
    const midi = Math.round(p.midi);
    if (!Number.isFinite(p.timeMs) || !(midi >= 0 && midi <= 127)) continue;
    const on = Math.max(0, Math.round(p.timeMs * ticksPerMs));
    const length =
      p.durationMs !== undefined && Number.isFinite(p.durationMs) ? Math.round(p.durationMs * ticksPerMs) : DEFAULT_TICKS;
    // a note-on with velocity 0 would be read as a note-off (MIDI 1.0), so 1 is the floor
    const velocity = Math.min(127, Math.max(1, Math.round(p.velocity ?? DEFAULT_VELOCITY)));
    takeSpans.push({ midi, on, off: on + Math.max(1, length), velocity });
  }
  const drillTrack = trackChunk([{ tick: 0, order: 0, data: trackName('Drill') }, ...noteEvents(drillSpans, 0)]);
  const takeTrack = trackChunk([{ tick: 0, order: 0, data: trackName('Take') }, ...noteEvents(takeSpans, 1)]);
  return smfBytes([conductor, drillTrack, takeTrack]);
}
