import { type NoteReading, readingWords, slipsOf } from './note-readings';

interface Props {
  readings: NoteReading[];
  /** notes played that belong to no written note */
  extras: number;
  meanOffsetMs: number | null;
  selected: number | null;
  onSelect: (index: number) => void;
  /** what choosing a slip does, e.g. "Pin a remark here" */
  actionLabel: string;
}

/** The take's slips in words, in order, each one a button that chooses its note. */
export function SlipList({ readings, extras, meanOffsetMs, selected, onSelect, actionLabel }: Props) {
  const slips = slipsOf(readings);
  const timed = readings.filter((r) => r.offsetMs !== null && r.verdict !== 'wrong');
  const drift =
    meanOffsetMs === null || timed.length === 0
      ? null
      : Math.abs(meanOffsetMs) < 5
        ? 'On the whole the notes sat on the beat.'
        : `On the whole the notes sat ${Math.round(Math.abs(meanOffsetMs))} ms ${meanOffsetMs < 0 ? 'ahead of' : 'behind'} the beat.`;
  return (
    <section className="grid gap-2" aria-labelledby="slips-heading" data-testid="slip-list">
      <h2 id="slips-heading" className="text-lead font-bold">
        Slips{' '}
        <span className="text-body font-normal text-muted">
          {slips.length === 0 ? 'none' : `${slips.length} of ${readings.length} notes`}
          {extras > 0 ? `, and ${extras} extra ${extras === 1 ? 'note' : 'notes'} played` : ''}
        </span>
      </h2>
      {drift ? <p className="text-muted">{drift}</p> : null}
      {slips.length === 0 ? (
        <p>Every written note was hit.</p>
      ) : (
        <ol className="grid max-h-80 gap-1 overflow-y-auto pr-1">
          {slips.map((r) => (
            <li key={r.index}>
              <button
                type="button"
                onClick={() => onSelect(r.index)}
                aria-pressed={selected === r.index}
                className={`flex w-full flex-wrap items-baseline justify-between gap-x-3 rounded-lg border px-3 py-2 text-left focus-visible:outline-2 ${
                  selected === r.index
                    ? 'border-dusk-500 bg-dusk-100 dark:bg-dusk-700'
                    : 'border-line bg-raised hover:border-ink-300'
                }`}
              >
                <span>{readingWords(r)}</span>
                <span className={`text-caption ${selected === r.index ? 'font-semibold' : 'text-muted'}`}>
                  {selected === r.index ? 'Chosen' : actionLabel}
                </span>
              </button>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
