export { drillToMidi } from './drill-midi';
export { MAX_FILE_NOTES, midiToPlayed } from './midi-to-played';
export { drillToMusicXml } from './musicxml';
