import { chordTones } from '@shared/engine/theory/chord-tones';
import { Note } from 'tonal';
import { type AudioEvent, padVoicing, type Schedule } from './schedule';

export interface ScalePreviewOptions {
  /** seconds per scale note (default 0.22, about eighths at 136 a minute) */
  step?: number;
}

/**
 * A pair's six-note scale heard over its chord: the pad holds the chord while the scale climbs
 * one octave, from the chord's root (or the scale's next note above it), and comes back down.
 * The line starts between G4 and F#5, above the pad, so both are heard. Pure, for tests.
 *
 * @example
 * scheduleScalePreview(['C', 'D', 'E', 'F#', 'G', 'A'], 'D7').events.filter((e) => e.kind === 'note').length // 13
 */
export function scheduleScalePreview(scale: string[], chord: string, opts: ScalePreviewOptions = {}): Schedule {
  const step = opts.step ?? 0.22;
  const rootChroma = Note.chroma(chordTones(chord)[0] ?? 'C') ?? 0;
  const chromas = scale
    .map((n) => Note.chroma(n))
    .filter((c): c is number => c !== undefined && !Number.isNaN(c))
    .sort((x, y) => ((x - rootChroma + 12) % 12) - ((y - rootChroma + 12) % 12));
  const up: number[] = [];
  for (const c of chromas) {
    // the first note between G4 and F#5, each next one the nearest above the last
    let m = up.length === 0 ? 67 + ((((c - 67) % 12) + 12) % 12) : 60 + c;
    while (up.length > 0 && m <= up[up.length - 1]) m += 12;
    while (up.length > 0 && m - 12 > up[up.length - 1]) m -= 12;
    up.push(m);
  }
  if (up.length > 0) up.push(up[0] + 12);
  const line = [...up, ...up.slice(0, -1).reverse()];
  const events: AudioEvent[] = line.map((midi, index) => ({
    kind: 'note',
    time: index * step,
    duration: step * 0.9,
    midi,
    velocity: index === 0 || index === up.length - 1 ? 100 : 84,
    index,
  }));
  const end = line.length * step + 0.4;
  const voicing = padVoicing(chord);
  if (voicing.length > 0) events.unshift({ kind: 'pad', time: 0, duration: end - 0.1, midis: voicing });
  return { events, downbeat: 0, end };
}
