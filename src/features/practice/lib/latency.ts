/**
 * Latency from taps along a click: each tap is paired with the nearest click within half a
 * beat; the median of those offsets (ms, positive = late) is the device's latency. The median
 * shrugs off a stray early or late tap. Null when fewer than four taps paired.
 *
 * @example
 * medianLatency([1000, 1500, 2000, 2500], [1030, 1520, 2025, 2540], 500) // 27.5
 */
export function medianLatency(clicks: number[], taps: number[], beatMs: number): number | null {
  const offsets: number[] = [];
  for (const tap of taps) {
    let best: number | null = null;
    for (const c of clicks) if (best === null || Math.abs(tap - c) < Math.abs(tap - best)) best = c;
    if (best !== null && Math.abs(tap - best) <= beatMs / 2) offsets.push(tap - best);
  }
  if (offsets.length < 4) return null;
  offsets.sort((a, b) => a - b);
  const mid = offsets.length >> 1;
  return offsets.length % 2 ? offsets[mid] : (offsets[mid - 1] + offsets[mid]) / 2;
}
