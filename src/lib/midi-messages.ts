/**
 * Channel-voice messages as the practice page needs them, per the MIDI 1.0 specification:
 * note-on with velocity 0 is a note-off; control change 2 is breath, 64 is the sustain pedal;
 * nothing but a note-on or note-off is ever a note.
 */
export type MidiEvent =
  | { kind: 'note-on'; midi: number; velocity: number; channel: number }
  | { kind: 'note-off'; midi: number; channel: number }
  | { kind: 'breath'; value: number; channel: number }
  | { kind: 'sustain'; down: boolean; channel: number }
  | { kind: 'other' };

export function parseMidiMessage(data: ArrayLike<number>): MidiEvent {
  if (data.length < 1) return { kind: 'other' };
  const status = data[0];
  const type = status & 0xf0;
  const channel = (status & 0x0f) + 1;
  if (type === 0x90 && data.length >= 3) {
    return data[2] === 0
      ? { kind: 'note-off', midi: data[1], channel }
      : { kind: 'note-on', midi: data[1], velocity: data[2], channel };
  }
  if (type === 0x80 && data.length >= 2) return { kind: 'note-off', midi: data[1], channel };
  if (type === 0xb0 && data.length >= 3) {
    if (data[1] === 2) return { kind: 'breath', value: data[2], channel };
    if (data[1] === 64) return { kind: 'sustain', down: data[2] >= 64, channel };
  }
  return { kind: 'other' };
}

/**
 * The computer keyboard as a small piano: the home row plays the white keys from C, the row
 * above it the black keys; Z and X move the octave down and up.
 */
export const computerKeyMap: Record<string, number> = {
  KeyA: 0, // C
  KeyW: 1, // C#
  KeyS: 2, // D
  KeyE: 3, // D#
  KeyD: 4, // E
  KeyF: 5, // F
  KeyT: 6, // F#
  KeyG: 7, // G
  KeyY: 8, // G#
  KeyH: 9, // A
  KeyU: 10, // A#
  KeyJ: 11, // B
  KeyK: 12, // C
  KeyO: 13, // C#
  KeyL: 14, // D
  KeyP: 15, // D#
  Semicolon: 16, // E
  Quote: 17, // F
};

export const octaveDownKey = 'KeyZ';
export const octaveUpKey = 'KeyX';
