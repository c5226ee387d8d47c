import { describe, expect, it } from 'vitest';
import { medianLatency } from '../../src/features/practice/lib/latency';

describe('medianLatency', () => {
  const clicks = Array.from({ length: 8 }, (_, i) => 1000 + i * 500);

  it('is the median of tap offsets', () => {
    const taps = clicks.map((c, i) => c + [20, 25, 30, 22, 28, 24, 26, 27][i]);
    expect(medianLatency(clicks, taps, 500)).toBe(25.5);
  });

  it('ignores a stray tap and taps far from any click', () => {
    const taps = [...clicks.slice(0, 6).map((c) => c + 30), clicks[6] + 240, 9000];
    expect(medianLatency(clicks, taps, 500)).toBe(30);
  });

  it('gives nothing for fewer than four taps', () => {
    expect(medianLatency(clicks, [1010, 1510, 2010], 500)).toBeNull();
  });
});
