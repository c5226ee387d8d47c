import { Chord } from 'tonal';
import { EngineError, parseTriad } from '../engine';
import type { DrillSpec } from '../engine/types';
import { chromaOf, rootSpelling } from '../engine/theory/spelling';

/**
 * The drill's key: the root of its first triad, spelled from C Db D Eb E F F# G Ab A Bb B; over
 * a progression, the root of its first chord (see chordKey).
 */
export function drillKey(spec: Pick<DrillSpec, 'pair' | 'changes'>): string {
  if (spec.changes && spec.changes.length > 0) return chordKey(spec.changes[0].chord);
  if (!spec.pair) throw new EngineError('A drill needs a pair or a progression.');
  return rootSpelling(chromaOf(parseTriad(spec.pair[0]).root));
}

/**
 * The key a chord of a progression counts for in the key map: its root, spelled from C Db D Eb
 * E F F# G Ab A Bb B.
 *
 * @example
 * chordKey('C#m7') // 'Db'
 */
export function chordKey(chord: string): string {
  const [tonic] = Chord.tokenize(chord);
  if (!tonic) throw new EngineError(`"${chord}" is not a chord symbol Sixfold can read.`);
  return rootSpelling(chromaOf(tonic));
}

export function patternName(spec: Pick<DrillSpec, 'pattern'>): string {
  return typeof spec.pattern === 'string' ? spec.pattern : `custom:${spec.pattern.name}`;
}

/**
 * What makes a drill the same drill in every key: its pattern, direction, instrument and the
 * shape of its pair (both qualities and the distance between the roots), not the key or tempo.
 *
 * @example
 * drillShape({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up' }) // 'weave|up|piano|major>major+10'
 */
export function drillShape(
  spec: Pick<DrillSpec, 'pair' | 'pattern' | 'direction' | 'instrument' | 'changes' | 'choruses'>,
): string {
  if (spec.changes && spec.changes.length > 0) return progressionShape(spec);
  if (!spec.pair) throw new EngineError('A drill needs a pair or a progression.');
  const a = parseTriad(spec.pair[0]);
  const b = parseTriad(spec.pair[1]);
  const semis = (((chromaOf(b.root) - chromaOf(a.root)) % 12) + 12) % 12;
  return `${patternName(spec)}|${spec.direction}|${spec.instrument ?? 'piano'}|${a.quality}>${b.quality}+${semis}`;
}

/** A progression's shape: each chord (and pinned pair) as semitones above the first chord's root. */
function progressionShape(
  spec: Pick<DrillSpec, 'pattern' | 'direction' | 'instrument' | 'changes' | 'choruses'>,
): string {
  const changes = spec.changes ?? [];
  const home = chromaOf(chordKey(changes[0].chord));
  const up = (pc: string) => (((chromaOf(pc) - home) % 12) + 12) % 12;
  const chords = changes.map((c) => {
    const [tonic, type] = Chord.tokenize(c.chord);
    let out = `${up(tonic)}${type}@${c.beats}`;
    if (c.pair) {
      const a = parseTriad(c.pair[0]);
      const b = parseTriad(c.pair[1]);
      out += `=${up(a.root)}${a.quality}>${up(b.root)}${b.quality}`;
    }
    return out;
  });
  return `${patternName(spec)}|${spec.direction}|${spec.instrument ?? 'piano'}|changes:${chords.join(',')}x${spec.choruses ?? 1}`;
}

/**
 * What a list shows for a drill's material: its pair, or its progression's chords.
 *
 * @example
 * drillMaterial({ pair: ['D', 'C'] }) // 'D/C'
 * drillMaterial({ changes: [{ chord: 'Dm7', beats: 4 }, { chord: 'G7', beats: 4 }] }) // 'Dm7 G7'
 */
export function drillMaterial(spec: Pick<DrillSpec, 'pair' | 'changes'>, separator = '/'): string {
  if (spec.changes && spec.changes.length > 0) return spec.changes.map((c) => c.chord).join(' ');
  return spec.pair ? spec.pair.join(separator) : '';
}
