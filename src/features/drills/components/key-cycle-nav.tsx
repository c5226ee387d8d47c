import type { Drill } from '@shared/engine';
import { Button } from '@/components/ui/button';

/** A key's name: its pair, or over a progression its first chord. */
const keyName = (d: Drill, separator = '/') => d.changes?.[0]?.chord ?? d.spec.pair.join(separator);

/** The 12 keys of the cycle, in the chosen order; one is shown at a time. */
export function KeyCycleNav({
  cycle,
  index,
  onChange,
}: {
  cycle: Drill[];
  index: number;
  onChange: (i: number) => void;
}) {
  if (cycle.length < 2) return null;
  return (
    <nav aria-label="Key cycle" className="flex flex-wrap items-center gap-1">
      <Button
        variant="quiet"
        onClick={() => onChange((index + cycle.length - 1) % cycle.length)}
        aria-label="Previous key"
      >
        ←
      </Button>
      <ol className="flex flex-wrap gap-1">
        {cycle.map((d, i) => (
          <li key={`${keyName(d)}-${i}`}>
            <button
              type="button"
              onClick={() => onChange(i)}
              aria-current={i === index ? 'true' : undefined}
              aria-label={`Key ${i + 1} of ${cycle.length}: ${keyName(d, ' / ')}`}
              className={`rounded-md border px-2 py-1 text-caption font-semibold ${i === index ? 'border-ink-800 bg-ink-800 text-white dark:border-brass-300 dark:bg-brass-300 dark:text-ink-950' : 'border-line bg-raised text-text hover:border-ink-300'}`}
            >
              {keyName(d)}
            </button>
          </li>
        ))}
      </ol>
      <Button variant="quiet" onClick={() => onChange((index + 1) % cycle.length)} aria-label="Next key">
        →
      </Button>
    </nav>
  );
}
