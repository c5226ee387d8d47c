import { describe, expect, it } from 'vitest';
import { generateDrill } from '../../shared/engine';
import { padVoicing, scheduleDrill } from '../../src/lib/audio/schedule';
import { encodeWav } from '../../src/lib/audio/wav';

const close = (a: number, b: number) => Math.abs(a - b) < 1e-9;

describe('scheduleDrill in a compound meter', () => {
  // 6/8 at 120: the tempo counts dotted quarters (common practice), so a quarter lasts 1/3 s.
  const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', tempo: 120, meter: [6, 8] });

  it('times notes by dotted-quarter beats and clicks twice a bar', () => {
    const { events, downbeat } = scheduleDrill(drill, { countInMeasures: 1 });
    // One 6/8 bar is two beats of half a second each.
    expect(downbeat).toBeCloseTo(1, 9);
    const first = drill.notes[3];
    const onset = events.find((e) => e.kind === 'note' && e.index === 3);
    expect(onset && close(onset.time, downbeat + (first.beat * 60) / 180)).toBe(true);
    const countIn = events.filter((e) => e.kind === 'click' && e.countIn).map((e) => e.time);
    expect(countIn.map((t) => Number(t.toFixed(9)))).toEqual([0, 0.5]);
  });
});

describe('scheduleDrill', () => {
  const drill = generateDrill({
    pair: ['D', 'C'],
    pattern: 'weave',
    direction: 'up',
    instrument: 'alto-sax',
    tempo: 90,
    chord: 'D7',
  });

  it('puts an onset at beat x 60 / tempo after the count-in for every note', () => {
    const { events, downbeat } = scheduleDrill(drill, { countInMeasures: 1 });
    expect(downbeat).toBeCloseTo((4 * 60) / 90, 9);
    const notes = events.filter((e) => e.kind === 'note');
    expect(notes).toHaveLength(drill.notes.length);
    drill.notes.forEach((n, i) => {
      const onset = notes.find((e) => e.kind === 'note' && e.index === i);
      expect(onset && close(onset.time, downbeat + (n.beat * 60) / 90), `note ${i}`).toBe(true);
      expect(onset?.kind === 'note' && onset.midi).toBe(n.midi);
    });
  });

  it('clicks on every beat, the count-in included, accenting each downbeat', () => {
    const { events, end } = scheduleDrill(drill, { countInMeasures: 2 });
    const clicks = events.filter((e) => e.kind === 'click');
    expect(clicks).toHaveLength((2 + drill.measures) * 4);
    clicks.forEach((c, k) => {
      expect(close(c.time, (k * 60) / 90)).toBe(true);
      expect(c.kind === 'click' && c.accent).toBe(k % 4 === 0);
      expect(c.kind === 'click' && c.countIn).toBe(k < 8);
    });
    expect(end).toBeCloseTo(((2 + drill.measures) * 4 * 60) / 90, 9);
  });

  it('clicks only the count-in when the click is off, and starts at 0 with no count-in', () => {
    const quiet = scheduleDrill(drill, { click: false, countInMeasures: 1 });
    expect(quiet.events.filter((e) => e.kind === 'click')).toHaveLength(4);
    const bare = scheduleDrill(drill, { click: false, countInMeasures: 0 });
    expect(bare.events[0]).toMatchObject({ kind: 'note', time: 0 });
  });

  it('counts the meter in its own beat: eighths in 7/8', () => {
    const seven = generateDrill({
      pair: ['D', 'C'],
      pattern: 'four-three',
      direction: 'up',
      tempo: 120,
      meter: [7, 8],
    });
    const { events, downbeat } = scheduleDrill(seven);
    const clicks = events.filter((e) => e.kind === 'click');
    expect(clicks.slice(0, 8).map((c) => c.time)).toEqual([0, 0.25, 0.5, 0.75, 1, 1.25, 1.5, 1.75]);
    expect(downbeat).toBe(1.75);
  });

  it("holds the DrillSpec's chord under each measure when the pad is on", () => {
    const padded = scheduleDrill(drill, { pad: true }).events.filter((e) => e.kind === 'pad');
    expect(padded).toHaveLength(drill.measures);
    expect(padded[0]).toMatchObject({ midis: [50, 54, 57, 60] }); // D3 F#3 A3 C4
    expect(scheduleDrill(drill, { pad: false }).events.some((e) => e.kind === 'pad')).toBe(false);
    const noChord = generateDrill({ pair: ['D', 'C'], pattern: 'weave', direction: 'up' });
    expect(scheduleDrill(noChord, { pad: true }).events.some((e) => e.kind === 'pad')).toBe(false);
  });

  it('voices a chord upward from C3', () => {
    expect(padVoicing('Bbm7')).toEqual([58, 61, 65, 68]);
    expect(padVoicing('Cmaj7#11')).toEqual([48, 52, 55, 59, 66]);
    expect(padVoicing('nonsense')).toEqual([]);
  });
});

describe('encodeWav', () => {
  it('writes a mono 16-bit PCM file with the samples in it', () => {
    const bytes = encodeWav(new Float32Array([0, 1, -1, 0.5]), 22050);
    const view = new DataView(bytes.buffer);
    expect(new TextDecoder().decode(bytes.slice(0, 4))).toBe('RIFF');
    expect(new TextDecoder().decode(bytes.slice(8, 12))).toBe('WAVE');
    expect(view.getUint32(24, true)).toBe(22050);
    expect(view.getUint16(34, true)).toBe(16);
    expect([0, 1, 2, 3].map((i) => view.getInt16(44 + i * 2, true))).toEqual([0, 32767, -32768, 16384]);
  });
});
