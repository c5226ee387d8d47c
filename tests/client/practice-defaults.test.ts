import { describe, expect, it } from 'vitest';
import type { PlayerSettings } from '../../shared/schemas/settings';
import { keepEdits } from '../../src/features/practice/components/practice-defaults';

const saved: PlayerSettings = {
  instrument: 'alto-sax',
  writtenPitchInput: true,
  octaveShift: 0,
  range: null,
  defaultTempo: 100,
  latency: {},
};

describe('practice settings form: fresh settings keep what the player typed', () => {
  it('a latency measured elsewhere arrives without wiping an unsaved tempo and instrument', () => {
    const draft = { ...saved, defaultTempo: 132, instrument: 'tenor-sax' as const };
    const next = { ...saved, latency: { 'Fake Keyboard': 12 } };
    const merged = keepEdits(draft, saved, next);
    expect(merged.defaultTempo).toBe(132);
    expect(merged.instrument).toBe('tenor-sax');
    expect(merged.latency).toEqual({ 'Fake Keyboard': 12 });
  });

  it('an untouched form takes the new settings whole', () => {
    const next = { ...saved, defaultTempo: 90 };
    expect(keepEdits(saved, saved, next)).toEqual(next);
  });
});
