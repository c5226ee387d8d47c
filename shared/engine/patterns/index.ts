export { generateDrill } from './generate';
export { inAllKeys } from './key-cycle';
export { candidatePairs, moveChanges, moveChordSymbol } from './changes';
export { sliceDrill } from './slice';
export { presets, PRESET_IDS } from './presets';
