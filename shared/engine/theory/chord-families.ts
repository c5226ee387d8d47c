/**
 * The usual scales for each chord family, in order of preference (common practice; the table in
 * the engine contract). Data only: the fit finder reads it.
 */
export interface ChordFamily {
  name: string;
  /** tonal scale names, rooted on the chord's root */
  scales: string[];
}

export type FamilyId =
  | 'major'
  | 'maj7#11'
  | 'maj7#5'
  | 'dominant'
  | '7sus4'
  | 'minor-triad'
  | 'minor-seventh'
  | 'minor-sixth'
  | 'half-diminished'
  | 'diminished'
  | 'augmented';

export const CHORD_FAMILIES: Record<FamilyId, ChordFamily> = {
  major: { name: 'major triad, 6, maj7, maj9', scales: ['major', 'lydian'] },
  'maj7#11': { name: 'maj7#11', scales: ['lydian'] },
  'maj7#5': { name: 'maj7#5', scales: ['lydian augmented'] },
  dominant: {
    name: 'dominant (3 + b7)',
    scales: [
      'mixolydian',
      'lydian dominant',
      'mixolydian b6',
      'half-whole diminished',
      'phrygian dominant',
      'whole tone',
      'altered',
    ],
  },
  '7sus4': { name: '7sus4', scales: ['mixolydian', 'dorian'] },
  'minor-triad': { name: 'minor triad', scales: ['dorian', 'aeolian', 'melodic minor'] },
  'minor-seventh': { name: 'm7, m9, m11', scales: ['dorian', 'aeolian', 'phrygian'] },
  'minor-sixth': { name: 'm6, m(maj7)', scales: ['dorian', 'melodic minor', 'harmonic minor'] },
  'half-diminished': { name: 'm7b5', scales: ['locrian #2', 'locrian'] },
  diminished: { name: 'diminished triad, dim7', scales: ['diminished', 'locrian'] },
  augmented: { name: 'augmented triad', scales: ['whole tone', 'lydian augmented'] },
};

/**
 * A chord's family from the semitones above its root that it holds (a set of 0..11).
 * Returns null for chords outside the table.
 *
 * @example
 * familyOf((st) => [0, 4, 7, 10].includes(st)) // 'dominant'
 */
export function familyOf(has: (semitones: number) => boolean): FamilyId | null {
  const maj3 = has(4);
  const min3 = has(3) && !maj3;
  const p5 = has(7);
  const sharp5 = has(8) && !p5;
  const flat5 = has(6) && !p5;
  const b7 = has(10);
  const maj7 = has(11);
  const sixth = has(9);
  if (maj3 && b7) return 'dominant';
  if (!maj3 && !has(3) && has(5)) return '7sus4';
  if (maj3 && sharp5) return maj7 ? 'maj7#5' : 'augmented';
  if (maj3 && maj7 && has(6)) return 'maj7#11';
  if (maj3) return 'major';
  if (min3 && flat5) {
    if (b7) return 'half-diminished';
    if (!maj7) return 'diminished';
    return null;
  }
  if (min3 && p5) {
    if (b7) return 'minor-seventh';
    if (sixth || maj7) return 'minor-sixth';
    return 'minor-triad';
  }
  return null;
}
