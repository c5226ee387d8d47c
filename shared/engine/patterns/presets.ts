import type { PatternDef, PatternId, TriadCellDef } from '../types';

const cell = (
  triad: 'a' | 'b',
  notes: 3 | 4,
  shape: TriadCellDef['shape'],
  motion: TriadCellDef['motion'],
  entry: TriadCellDef['entry'],
): TriadCellDef => ({ triad, notes, shape, motion, entry });

/**
 * The patterns Sixfold ships, as PatternDefs (ids are stable). Written for the ascending drill;
 * the descending form mirrors them. The drill's first cell always enters at its start note.
 *
 * @example
 * presets.weave.cells.length // 2: an a cell up, a b cell down
 */
export const presets: Record<PatternId, PatternDef> = {
  stack: {
    name: 'Stack',
    subdivision: 'triplet',
    source: 'triads',
    cells: [cell('a', 3, 'line', 'up', 'start'), cell('b', 3, 'line', 'up', 'above')],
  },
  weave: {
    name: 'Weave',
    subdivision: 'triplet',
    source: 'triads',
    cells: [cell('a', 3, 'line', 'up', 'start'), cell('b', 3, 'line', 'down', 'above')],
  },
  'weave-four': {
    name: 'Weave in fours',
    subdivision: 'eighth',
    source: 'triads',
    cells: [cell('a', 4, 'line', 'up', 'start'), cell('b', 4, 'line', 'down', 'above')],
  },
  'leap-back': {
    name: 'Leap back',
    subdivision: 'eighth',
    source: 'triads',
    cells: [cell('a', 4, 'leap', 'up', 'next-position'), cell('b', 4, 'leap', 'up', 'same-position')],
  },
  'four-three': {
    name: 'Four-three',
    subdivision: 'eighth',
    source: 'triads',
    cells: [cell('a', 4, 'line', 'up', 'next-position'), cell('b', 3, 'line', 'down', 'below')],
  },
  'scale-steps': {
    name: 'Scale steps',
    subdivision: 'eighth',
    source: 'scale',
    degrees: [0, 1, 2, 4, 3, 2, 1, 0],
    step: 1,
  },
  'scale-steps-triplet': {
    name: 'Scale steps in triplets',
    subdivision: 'triplet',
    source: 'scale',
    degrees: [0, 1, 2, 4, 3, 2],
    step: 1,
  },
};

/**
 * Preset ids, in the order the product lists them.
 *
 * @example
 * PRESET_IDS[0] // 'stack'
 */
export const PRESET_IDS = Object.keys(presets) as PatternId[];
