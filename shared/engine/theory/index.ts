export { parseTriad } from './triads';
export { triadPair, allPairs } from './pairs';
export { pairsForChord } from './fit-finder';
export { ROOT_SPELLINGS } from './spelling';
export { movePair, semitoneInterval, spellPairAsUnit } from './pair-spelling';
