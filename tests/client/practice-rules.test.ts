import { describe, expect, it } from 'vitest';
import { initialLadder, ladderSteps, nextLadderState } from '../../shared/practice/ladder';
import { climbVerdict, defaultHitWindowMs, nextTempo } from '../../shared/practice/tempo-climb';

describe('ladder', () => {
  it('adds one measure at a time and joins it to what came before', () => {
    expect(ladderSteps(1)).toEqual([[1, 1]]);
    expect(ladderSteps(4)).toEqual([
      [1, 1],
      [2, 2],
      [1, 2],
      [3, 3],
      [1, 3],
      [4, 4],
      [1, 4],
    ]);
  });

  it('passes a step after two clean takes in a row, fading the notation as steps pass', () => {
    const clean = { accuracy: 1, missed: 0 };
    const one = nextLadderState(initialLadder, clean, 7);
    expect(one).toEqual({ step: 0, streak: 1, fade: 0 });
    const two = nextLadderState(one, clean, 7);
    expect(two).toEqual({ step: 1, streak: 0, fade: 1 });
    const three = nextLadderState(nextLadderState(two, clean, 7), clean, 7);
    expect(three).toEqual({ step: 2, streak: 0, fade: 2 });
  });

  it('a miss or a take under 95% resets the streak and brings the notation back', () => {
    const faded = { step: 2, streak: 1, fade: 2 as const };
    expect(nextLadderState(faded, { accuracy: 0.97, missed: 1 }, 7)).toEqual({ step: 2, streak: 0, fade: 0 });
    expect(nextLadderState(faded, { accuracy: 0.9, missed: 0 }, 7)).toEqual({ step: 2, streak: 0, fade: 0 });
  });
});

describe('tempo climb', () => {
  it('raises 4 after a clean take, lowers 8 under 80%, holds between', () => {
    expect(nextTempo(100, { accuracy: 0.95, meanOffsetMs: -20 }, 75)).toBe(104);
    expect(nextTempo(100, { accuracy: 0.79, meanOffsetMs: 0 }, 75)).toBe(92);
    expect(nextTempo(100, { accuracy: 0.9, meanOffsetMs: 0 }, 75)).toBe(100);
  });

  it('does not climb when the take is accurate but rushed beyond the hit window', () => {
    expect(climbVerdict({ accuracy: 1, meanOffsetMs: -80 }, 75)).toBe('hold');
  });

  it('uses the scorer default hit window', () => {
    // The scorer's default: hitWindowMs = min(90, max(35, beat ms / 8)); at 120 bpm a beat is 500 ms.
    expect(defaultHitWindowMs(120)).toBe(62.5);
    expect(defaultHitWindowMs(40)).toBe(90);
    expect(defaultHitWindowMs(300)).toBe(35);
  });
});
