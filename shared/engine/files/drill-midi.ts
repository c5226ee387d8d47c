import { instruments } from '../instruments';
import type { Drill } from '../types';
import { quarterTempo } from '../patterns/timing';
import { smfWith, toUnit } from './smf';

/** Velocity of the drill's notes (MIDI 0-127). */
const VELOCITY = 96;

/**
 * A drill as a Standard MIDI File (format 1): a conductor track with tempo and meter, then a
 * track named "Drill" with the notes at concert pitch and the instrument's General MIDI program,
 * time 0 at the first downbeat; over a progression, a marker names each chord where it starts.
 *
 * @example
 * const bytes = drillToMidi(generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up' }));
 * // bytes starts with "MThd"
 */
export function drillToMidi(drill: Drill): Uint8Array {
  const { tempo, meter, instrument } = drill.spec;
  // the tempo counts the meter's beat (a dotted quarter in 6/8): the file counts quarters
  const file = smfWith('Sixfold', quarterTempo(tempo, meter), meter);
  const ppq = file.header.ppq;
  // a marker per chord of a progression, in the conductor track (Standard MIDI Files 1.0: FF 06)
  for (const c of drill.changes ?? []) {
    file.header.meta.push({ type: 'marker', text: c.chord, ticks: Math.round(c.startBeat * ppq) });
  }
  const track = file.addTrack();
  track.name = 'Drill';
  track.channel = 0;
  track.instrument.number = instruments[instrument]?.program ?? 0;
  for (const n of drill.notes) {
    const ticks = Math.round(n.beat * ppq);
    const off = Math.round((n.beat + n.duration) * ppq);
    track.addNote({ midi: n.midi, ticks, durationTicks: off - ticks, velocity: toUnit(VELOCITY) });
  }
  return file.toArray();
}
