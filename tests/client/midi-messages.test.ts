import { describe, expect, it } from 'vitest';
import { computerKeyMap, parseMidiMessage } from '../../src/lib/midi-messages';

describe('parseMidiMessage', () => {
  it('reads a note-on with its channel and velocity', () => {
    // MIDI 1.0: status 0x9n is note-on on channel n+1; middle C is note 60.
    expect(parseMidiMessage([0x90, 60, 100])).toEqual({ kind: 'note-on', midi: 60, velocity: 100, channel: 1 });
    expect(parseMidiMessage([0x93, 69, 1])).toEqual({ kind: 'note-on', midi: 69, velocity: 1, channel: 4 });
  });

  it('treats a note-on with velocity 0 as a note-off', () => {
    // MIDI 1.0: "a Note On message with a velocity of 0 is equivalent to a Note Off".
    expect(parseMidiMessage([0x90, 60, 0])).toEqual({ kind: 'note-off', midi: 60, channel: 1 });
    expect(parseMidiMessage([0x85, 62, 64])).toEqual({ kind: 'note-off', midi: 62, channel: 6 });
  });

  it('never reads the sustain pedal or breath as a note', () => {
    // MIDI 1.0 control numbers: 2 = breath controller, 64 = damper (sustain) pedal.
    expect(parseMidiMessage([0xb0, 2, 90])).toEqual({ kind: 'breath', value: 90, channel: 1 });
    expect(parseMidiMessage([0xb0, 64, 127])).toEqual({ kind: 'sustain', down: true, channel: 1 });
    expect(parseMidiMessage([0xb0, 64, 0])).toEqual({ kind: 'sustain', down: false, channel: 1 });
    expect(parseMidiMessage([0xb0, 7, 100]).kind).toBe('other');
    expect(parseMidiMessage([0xe0, 0, 64]).kind).toBe('other');
    expect(parseMidiMessage([0xf8]).kind).toBe('other');
    expect(parseMidiMessage([]).kind).toBe('other');
  });

  it('maps the computer keyboard to an octave and a third of semitones', () => {
    expect(computerKeyMap.KeyA).toBe(0);
    expect(computerKeyMap.KeyK).toBe(12);
    const offsets = Object.values(computerKeyMap).sort((a, b) => a - b);
    expect(offsets).toEqual(Array.from({ length: 18 }, (_, i) => i));
  });
});
