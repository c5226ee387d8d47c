import type { Drill } from '@shared/engine';
import { drillLengthProblem } from './drill-length';

/** Says beside the staff that a drill is too short to be the whole exercise, so it never looks finished. */
export function ShortDrillNotice({ drill }: { drill: Drill }) {
  const problem = drillLengthProblem(drill);
  if (!problem) return null;
  return (
    <p
      role="status"
      data-testid="short-drill"
      className="rounded-lg border border-dashed border-ember-500 px-3 py-2 text-caption font-semibold text-ember-700 dark:text-ember-100"
    >
      {problem}
    </p>
  );
}
