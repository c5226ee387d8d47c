export { drillToMidi } from './drill-midi';
export { midiToPlayed } from './midi-to-played';
export { drillToMusicXml } from './musicxml';
