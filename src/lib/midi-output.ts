import { WebMidi } from 'webmidi';

/** MIDI outputs, for sending the played notes on to an outboard sound module instead of the synth. */
export function listOutputs(): Array<{ id: string; name: string }> {
  if (!WebMidi.enabled) return [];
  return WebMidi.outputs.map((o) => ({ id: o.id, name: o.name }));
}

/** Sends one note-on or note-off (MIDI 1.0: 0x90 / 0x80 on channel 1) to an output by id. */
export function sendNote(outputId: string, type: 'on' | 'off', midi: number, velocity: number) {
  const out = WebMidi.enabled ? WebMidi.getOutputById(outputId) : undefined;
  if (!out) return;
  out.send(type === 'on' ? [0x90, midi, Math.max(1, velocity)] : [0x80, midi, 0]);
}
