/**
 * The fit finder's first answers in a fresh process: what a player waits for the first time the
 * drills page lays a 12-bar blues through the key cycle (24 chords: a dominant seventh and a
 * minor seventh on each root). Run by the `changes` section, once per child process, since only
 * a new process starts with empty caches.
 */
import { pairsForChord } from '../../shared/engine';

const ROOTS = ['F', 'Bb', 'Eb', 'Ab', 'Db', 'Gb', 'B', 'E', 'A', 'D', 'G', 'C'];
export const COLD_CHORDS = [...ROOTS.map((r) => `${r}7`), ...ROOTS.map((r) => `${r}m7`)];

/** Milliseconds of each chord's first answer, in the order of COLD_CHORDS. */
function firstAnswers(): number[] {
  return COLD_CHORDS.map((chord) => {
    const t0 = performance.now();
    pairsForChord(chord);
    return performance.now() - t0;
  });
}

const invokedDirectly = typeof process !== 'undefined' && process.argv[1]?.endsWith('fit-finder-cold.ts');
if (invokedDirectly) console.log(JSON.stringify(firstAnswers()));
