import { type Drill, instruments, parseTriad, ROOT_SPELLINGS } from '@shared/engine';
import { Note } from 'tonal';

const SUFFIX = { major: '', minor: 'm', diminished: 'dim', augmented: 'aug' } as const;

/** A triad symbol as the instrument reads it (D on alto sax is written B), as ENGINE.md spells it. */
export function writtenTriad(symbol: string, transposition: number): string {
  const t = parseTriad(symbol);
  const chroma = Note.chroma(t.root) ?? 0;
  return ROOT_SPELLINGS[(((chroma - transposition) % 12) + 12) % 12] + SUFFIX[t.quality];
}

/** "D / C", with "(written B / A)" for a transposing instrument. */
export function pairTitle(drill: Drill): string {
  const { pair, instrument } = drill.spec;
  const tr = instruments[instrument].transposition;
  const concert = pair.join(' / ');
  if (tr % 12 === 0) return concert;
  return `${concert} (written ${pair.map((p) => writtenTriad(p, tr)).join(' / ')})`;
}
