/**
 * A fast count of the notes in a track chunk, made before @tonejs/midi reads it: the package pairs
 * note-ons with note-offs in time roughly quadratic in the notes, so a dense 1 MB file (some
 * 120,000 notes) takes seconds to read. Only the framing of events is followed, nothing is kept.
 */

/** What a walk through one track chunk's events found. */
export interface NoteOnCount {
  /** note-ons (status 9n) with a velocity above 0, as far as the events made sense */
  noteOns: number;
  /**
   * A variable-length quantity longer than the four bytes Standard MIDI Files 1.0 allows. The
   * package's parser adds such a length up in 32 bits; it can come out below 0 and send the parser
   * back over the same bytes for ever, so such a file must not reach it.
   */
  overlong: boolean;
}

const CUT = -1;
const OVERLONG = -2;

/**
 * Counts the note-ons with velocity > 0 in the events of one MTrk chunk (the bytes after its
 * length): delta times and lengths as variable-length quantities, running status, meta events
 * (FF type length data), sysex (F0 or F7 length data), and the data bytes of each channel message
 * (8n 9n An Bn En two, Cn Dn one). As in the package's parser, a meta or sysex event leaves the
 * running status as it was. Bytes that make no sense (running status before any status, a system
 * message F1-FE, an event cut off by the chunk's end) end the count there: reading the chunk is
 * left to the package and the checks around it. Never throws.
 *
 * @example
 * countNoteOns(Uint8Array.from([0, 0x90, 60, 100, 10, 62, 100, 10, 60, 0])).noteOns // 2
 */
export function countNoteOns(events: Uint8Array): NoteOnCount {
  const end = events.length;
  let p = 0;
  let status = 0;
  let noteOns = 0;
  // the quantity at p (p moved past it), CUT when the chunk ends inside it, OVERLONG past 4 bytes
  const quantity = (): number => {
    let value = 0;
    for (let i = 0; i < 4; i++) {
      if (p >= end) return CUT;
      const b = events[p++];
      value = value * 128 + (b & 0x7f);
      if (b < 0x80) return value;
    }
    return OVERLONG;
  };
  while (p < end) {
    const delta = quantity();
    if (delta < 0) return { noteOns, overlong: delta === OVERLONG };
    if (p >= end) break;
    const first = events[p];
    if (first >= 0xf0) {
      p++;
      if (first === 0xff)
        p++; // the meta event's type
      else if (first !== 0xf0 && first !== 0xf7) break;
      const length = quantity();
      if (length < 0) return { noteOns, overlong: length === OVERLONG };
      p += length;
      continue;
    }
    if (first >= 0x80) {
      status = first;
      p++;
    } else if (status === 0) {
      break;
    }
    const kind = status >> 4;
    const data = kind === 0xc || kind === 0xd ? 1 : 2;
    if (p + data > end) break;
    if (kind === 0x9 && events[p + 1] > 0) noteOns++;
    p += data;
  }
  return { noteOns, overlong: false };
}
