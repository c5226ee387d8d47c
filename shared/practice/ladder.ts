/**
 * The ladder memorises a drill measure by measure: 1, 2, 1-2, 3, 1-3, ... 1-N. A step passes
 * after two takes in a row at 95% or better with no miss.
 *
 * @example
 * ladderSteps(3) // [[1,1],[2,2],[1,2],[3,3],[1,3]]
 */
export function ladderSteps(measures: number): Array<[number, number]> {
  const steps: Array<[number, number]> = [];
  for (let m = 1; m <= measures; m++) {
    steps.push([m, m]);
    if (m > 1) steps.push([1, m]);
  }
  return steps;
}

export const LADDER_PASS_ACCURACY = 0.95;
export const LADDER_PASSES_NEEDED = 2;

export interface LadderState {
  step: number;
  /** clean takes in a row at this step */
  streak: number;
  /** 0 = full notation, 1 = faint, 2 = hidden */
  fade: 0 | 1 | 2;
}

export const initialLadder: LadderState = { step: 0, streak: 0, fade: 0 };

/**
 * The next state after a take at the current step. The notation fades (full, faint, hidden) as
 * steps pass and comes back in full after a failed take.
 *
 * @example
 * nextLadderState({ step: 0, streak: 1, fade: 0 }, { accuracy: 1, missed: 0 }, 5) // { step: 1, streak: 0, fade: 1 }
 */
export function nextLadderState(
  state: LadderState,
  take: { accuracy: number; missed: number },
  totalSteps: number,
): LadderState {
  const clean = take.accuracy >= LADDER_PASS_ACCURACY && take.missed === 0;
  if (!clean) return { step: state.step, streak: 0, fade: 0 };
  const streak = state.streak + 1;
  if (streak >= LADDER_PASSES_NEEDED) {
    return { step: Math.min(state.step + 1, totalSteps), streak: 0, fade: Math.min(2, state.fade + 1) as 0 | 1 | 2 };
  }
  return { step: state.step, streak, fade: state.fade };
}
