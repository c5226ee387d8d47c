/** The test hook fake-midi.js installs in the page (see tests/e2e/fake-midi.js). */
interface FakeMidiHook {
  send(bytes: number[], timestamp?: number, inputId?: string): void;
  noteOn(note: number, velocity: number, channel?: number, timestamp?: number): void;
  noteOff(note: number, velocity?: number, channel?: number, timestamp?: number): void;
  addInput(port: { id: string; name: string; manufacturer?: string }): void;
  removeInput(id: string): void;
  outputLog: Array<{ portId: string; data: number[]; timestamp: number }>;
}

interface Window {
  __fakeMidi: FakeMidiHook;
}

declare const __fakeMidi: FakeMidiHook;
