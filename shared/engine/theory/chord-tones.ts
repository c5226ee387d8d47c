import { Chord } from 'tonal';

/** Spells a chord symbol the way tonal reads it ("Cm(maj7)" -> "CmMaj7", "C7(b9)" -> "C7b9"). */
function tonalChordSymbol(symbol: string): string {
  return symbol
    .trim()
    .replace(/m\(maj7\)|m\(M7\)|-\(maj7\)/, 'mMaj7')
    .replace(/\(([^)]*)\)/g, '$1');
}

/**
 * The chord's tones as pitch classes, root first; empty when the symbol is not a chord.
 *
 * @example
 * chordTones('D7') // ['D', 'F#', 'A', 'C']
 */
export function chordTones(symbol: string): string[] {
  return Chord.get(tonalChordSymbol(symbol)).notes;
}
