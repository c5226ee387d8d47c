/**
 * Sixfold's drill engine: its public contract is shared/engine/README.md.
 * Pure and browser-safe: no DOM, no node:* modules, no network.
 */
export * from './types';
export { EngineError } from './errors';
export * from './theory';
export * from './patterns';
export { instruments, writtenPair } from './instruments';
export type { InstrumentClef, InstrumentEntry } from './instruments';
export * from './files';
export * from './scoring';
export { takeToMidi } from './files/take-midi';
export { notate, ottavaOctaves } from './notation';
export { beatGroups, isCompound, quarterTempo } from './patterns/timing';
