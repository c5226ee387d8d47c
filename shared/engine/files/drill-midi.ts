import { instruments } from '../instruments';
import type { Drill } from '../types';
import { PPQ, type TrackEvent, setTempo, smfBytes, timeSignature, trackChunk, trackName } from './smf';

/** Velocity of the drill's notes (MIDI 0-127). */
const VELOCITY = 96;

/**
 * A drill as a Standard MIDI File (format 1): a conductor track with tempo and meter, then a
 * track named "Drill" with the notes at concert pitch, time 0 at the first downbeat.
 *
 * @example
 * const bytes = drillToMidi(generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up' }));
 * // bytes starts with "MThd"
 */
export function drillToMidi(drill: Drill): Uint8Array {
  const { tempo, meter, instrument } = drill.spec;
  const conductor = trackChunk([
    { tick: 0, order: 0, data: trackName('Sixfold') },
    { tick: 0, order: 1, data: timeSignature(meter[0], meter[1]) },
    { tick: 0, order: 2, data: setTempo(tempo) },
  ]);
  const events: TrackEvent[] = [
    { tick: 0, order: 0, data: trackName('Drill') },
    { tick: 0, order: 1, data: [0xc0, instruments[instrument]?.program ?? 0] },
  ];
  for (const n of drill.notes) {
    const on = Math.round(n.beat * PPQ);
    const off = Math.round((n.beat + n.duration) * PPQ);
    events.push({ tick: on, order: 3, data: [0x90, n.midi, VELOCITY] });
    events.push({ tick: off, order: 2, data: [0x80, n.midi, 0] });
  }
  return smfBytes([conductor, trackChunk(events)]);
}
