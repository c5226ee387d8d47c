import { parseTriad } from '../engine';
import type { DrillSpec } from '../engine/types';
import { chromaOf, rootSpelling } from '../engine/theory/spelling';

/** The drill's key: the root of its first triad, spelled from C Db D Eb E F F# G Ab A Bb B. */
export function drillKey(spec: Pick<DrillSpec, 'pair'>): string {
  return rootSpelling(chromaOf(parseTriad(spec.pair[0]).root));
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
export function drillShape(spec: Pick<DrillSpec, 'pair' | 'pattern' | 'direction' | 'instrument'>): string {
  const a = parseTriad(spec.pair[0]);
  const b = parseTriad(spec.pair[1]);
  const semis = (((chromaOf(b.root) - chromaOf(a.root)) % 12) + 12) % 12;
  return `${patternName(spec)}|${spec.direction}|${spec.instrument ?? 'piano'}|${a.quality}>${b.quality}+${semis}`;
}
