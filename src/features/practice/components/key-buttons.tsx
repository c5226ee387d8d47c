import type { Drill } from '@shared/engine';
import { drillKey } from '@shared/practice/drill-identity';

/** One button per key of the cycle; the key being practised is marked current. */
export function KeyButtons({
  drills,
  current,
  disabled,
  onPick,
}: {
  drills: Drill[];
  current: number;
  disabled: boolean;
  onPick: (index: number) => void;
}) {
  return (
    <nav aria-label="Keys of the cycle" className="flex flex-wrap gap-1">
      {drills.map((d, i) => (
        <button
          key={drillKey(d.spec)}
          type="button"
          disabled={disabled}
          onClick={() => onPick(i)}
          aria-current={i === current ? 'true' : undefined}
          className={`rounded-md px-2.5 py-1 text-caption font-bold ${i === current ? 'bg-ink-800 text-white dark:bg-brass-300 dark:text-ink-950' : 'border border-line'}`}
        >
          {drillKey(d.spec)}
        </button>
      ))}
    </nav>
  );
}
