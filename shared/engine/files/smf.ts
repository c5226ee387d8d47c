/**
 * Bytes of Standard MIDI Files (Standard MIDI Files 1.0): a small writer for the engine's own
 * files. Reading lives in midi-to-played.ts.
 */

/** Ticks per quarter note in files Sixfold writes: divisible by 2, 3, 4, 8 and 16. */
export const PPQ = 480;

/** A timed event for a track: `data` is the status byte and what follows it. */
export interface TrackEvent {
  tick: number;
  /** events at one tick sort by this (note-offs before note-ons) */
  order: number;
  data: number[];
}

/**
 * A variable-length quantity (Standard MIDI Files 1.0): 7 bits a byte, high bit set on all but the last.
 *
 * @example
 * vlq(480) // [0x83, 0x60]
 */
export function vlq(value: number): number[] {
  let v = Math.max(0, Math.round(value));
  const bytes = [v & 0x7f];
  v = Math.floor(v / 128);
  while (v > 0) {
    bytes.unshift((v & 0x7f) | 0x80);
    v = Math.floor(v / 128);
  }
  return bytes;
}

function ascii(text: string): number[] {
  return Array.from(text, (ch) => {
    const c = ch.charCodeAt(0);
    return c < 128 ? c : 63;
  });
}

/**
 * A meta event: FF, its type, the payload's length and the payload.
 *
 * @example
 * metaEvent(0x2f, []) // [0xff, 0x2f, 0] (end of track)
 */
export function metaEvent(type: number, payload: number[]): number[] {
  return [0xff, type, ...vlq(payload.length), ...payload];
}

/**
 * A track-name meta event (ASCII; other characters become "?").
 *
 * @example
 * trackName('Drill') // [0xff, 0x03, 5, 68, 114, 105, 108, 108]
 */
export function trackName(name: string): number[] {
  return metaEvent(0x03, ascii(name));
}

/**
 * Set tempo: microseconds per quarter note = 60,000,000 / bpm (Standard MIDI Files 1.0).
 *
 * @example
 * setTempo(120) // [0xff, 0x51, 3, 0x07, 0xa1, 0x20] (500,000 us)
 */
export function setTempo(bpm: number): number[] {
  const us = Math.round(60_000_000 / bpm);
  return metaEvent(0x51, [(us >> 16) & 0xff, (us >> 8) & 0xff, us & 0xff]);
}

/**
 * Time signature: numerator, denominator as a power of two, 24 clocks per click, 8 32nds per quarter.
 *
 * @example
 * timeSignature(7, 8) // [0xff, 0x58, 4, 7, 3, 24, 8]
 */
export function timeSignature(num: number, den: number): number[] {
  return metaEvent(0x58, [num, Math.round(Math.log2(den)), 24, 8]);
}

function chunk(type: string, body: number[]): number[] {
  const n = body.length;
  return [...ascii(type), (n >>> 24) & 0xff, (n >>> 16) & 0xff, (n >>> 8) & 0xff, n & 0xff, ...body];
}

/**
 * A track chunk from events in any order; an end-of-track event is added.
 *
 * @example
 * trackChunk([{ tick: 0, order: 0, data: trackName('Drill') }]) // 'MTrk', length, events
 */
export function trackChunk(events: TrackEvent[]): number[] {
  const sorted = [...events].sort((x, y) => x.tick - y.tick || x.order - y.order);
  const body: number[] = [];
  let now = 0;
  for (const e of sorted) {
    body.push(...vlq(e.tick - now), ...e.data);
    now = e.tick;
  }
  body.push(0, ...metaEvent(0x2f, []));
  return chunk('MTrk', body);
}

/**
 * A format 1 file from track chunks.
 *
 * @example
 * smfBytes([trackChunk([])]).slice(0, 4) // 'MThd' in ASCII
 */
export function smfBytes(tracks: number[][], ppq = PPQ): Uint8Array {
  const header = chunk('MThd', [0, 1, (tracks.length >> 8) & 0xff, tracks.length & 0xff, (ppq >> 8) & 0xff, ppq & 0xff]);
  const out: number[] = header;
  for (const t of tracks) for (const b of t) out.push(b);
  return Uint8Array.from(out);
}
