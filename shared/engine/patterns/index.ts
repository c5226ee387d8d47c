export { generateDrill } from './generate';
export { inAllKeys } from './key-cycle';
export { sliceDrill } from './slice';
export { presets, PRESET_IDS } from './presets';
