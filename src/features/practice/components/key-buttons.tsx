import type { Drill } from '@shared/engine';
import { drillKey } from '@shared/practice/drill-identity';
import type { PitchFrame } from '../lib/pitch-frame';

/**
 * One button per key of the cycle, named in the player's frame (a transposing player reads her
 * written key, the concert key in small type under it); the key being practised is current.
 */
export function KeyButtons({
  drills,
  current,
  disabled,
  frame,
  onPick,
}: {
  drills: Drill[];
  current: number;
  disabled: boolean;
  frame: PitchFrame;
  onPick: (index: number) => void;
}) {
  return (
    <nav aria-label="Keys of the cycle" className="flex flex-wrap gap-1">
      {drills.map((d, i) => (
        <button
          key={drillKey(d.spec)}
          type="button"
          data-key={drillKey(d.spec)}
          disabled={disabled}
          onClick={() => onPick(i)}
          aria-current={i === current ? 'true' : undefined}
          className={`rounded-md px-2.5 py-1 text-caption font-bold ${i === current ? 'bg-ink-800 text-white dark:bg-brass-300 dark:text-ink-950' : 'border border-line'}`}
        >
          {frame.transposing ? (
            <>
              <span className="block">{frame.drillKey(d.spec)}</span>
              <small className="block text-[10px] font-normal leading-none">
                <span className="sr-only">concert </span>
                {drillKey(d.spec)}
              </small>
            </>
          ) : (
            drillKey(d.spec)
          )}
        </button>
      ))}
    </nav>
  );
}
