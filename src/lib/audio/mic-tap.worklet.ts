/**
 * Runs in the audio thread (an AudioWorklet): gathers the microphone's samples into blocks of
 * 1024 (about 21 ms at 48 kHz) and posts each to the page with the context frame of its first
 * sample. The note detector runs on the page, so this stays small and never blocks the audio.
 * Loaded by URL from the app's own origin, so a script-src 'self' policy allows it.
 */

// The audio worklet's global scope is not in TypeScript's DOM library.
declare const currentFrame: number;
declare function registerProcessor(name: string, ctor: new () => AudioWorkletProcessorLike): void;
interface AudioWorkletProcessorLike {
  readonly port: MessagePort;
  process(inputs: Float32Array[][]): boolean;
}
declare const AudioWorkletProcessor: { prototype: AudioWorkletProcessorLike; new (): AudioWorkletProcessorLike };

const BLOCK = 1024;

class MicTap extends AudioWorkletProcessor {
  private block = new Float32Array(BLOCK);
  private filled = 0;
  private startFrame = 0;

  process(inputs: Float32Array[][]): boolean {
    const channel = inputs[0]?.[0];
    if (!channel) return true;
    let i = 0;
    while (i < channel.length) {
      if (this.filled === 0) this.startFrame = currentFrame + i;
      const n = Math.min(channel.length - i, BLOCK - this.filled);
      this.block.set(channel.subarray(i, i + n), this.filled);
      this.filled += n;
      i += n;
      if (this.filled === BLOCK) {
        this.port.postMessage({ samples: this.block, startFrame: this.startFrame }, [this.block.buffer]);
        this.block = new Float32Array(BLOCK);
        this.filled = 0;
      }
    }
    return true;
  }
}

registerProcessor('sixfold-mic-tap', MicTap);
