import { type KeyboardEvent, useRef } from 'react';
import { type NoteReading, readingWords, type Verdict } from './note-readings';

/** Each verdict's colour (text and tick) and a glyph, so it reads without colour too. */
const LOOK: Record<Verdict, { cls: string; glyph: string; word: string }> = {
  hit: { cls: 'text-reed-700 dark:text-reed-100', glyph: '✓', word: 'hit' },
  early: { cls: 'text-brass-700 dark:text-brass-300', glyph: '‹', word: 'early' },
  late: { cls: 'text-brass-700 dark:text-brass-300', glyph: '›', word: 'late' },
  wrong: { cls: 'text-ember-700 dark:text-ember-100', glyph: '✕', word: 'wrong' },
  missed: { cls: 'text-ember-700 dark:text-ember-100', glyph: '○', word: 'missed' },
};

/** The widest offset the ticks show, in ms: the take's own widest, at least 60. */
export function tickScale(readings: NoteReading[]): number {
  const widest = Math.max(0, ...readings.map((r) => Math.abs(r.offsetMs ?? 0)));
  return Math.max(60, Math.ceil(widest / 20) * 20);
}

interface Props {
  readings: NoteReading[];
  selected: number | null;
  onSelect: (index: number) => void;
  /** notes with a remark pinned to them */
  pinned?: ReadonlySet<number>;
}

/**
 * Note by note, as written and as played: each written note over what was heard (the pitch
 * played instead of a wrong one), with a tick left of the centre line for a note played ahead
 * of the beat and right of it for one behind. A note is a button: click it, or move along with
 * the arrow keys and press Enter, to choose it (to pin a remark, or read the remarks on it).
 */
export function NoteStrip({ readings, selected, onSelect, pinned }: Props) {
  const scale = tickScale(readings);
  const buttons = useRef<(HTMLButtonElement | null)[]>([]);
  const focusable = selected ?? 0;
  const onKey = (e: KeyboardEvent, i: number) => {
    const to =
      e.key === 'ArrowRight'
        ? i + 1
        : e.key === 'ArrowLeft'
          ? i - 1
          : e.key === 'Home'
            ? 0
            : e.key === 'End'
              ? readings.length - 1
              : null;
    if (to === null) return;
    e.preventDefault();
    buttons.current[Math.max(0, Math.min(readings.length - 1, to))]?.focus();
  };
  return (
    <figure className="m-0 grid gap-2" data-testid="note-strip">
      <figcaption className="text-caption text-muted">
        Each note as written (top) and as played: a tick left of the line was ahead of the beat, right of it behind; the
        edges are ±{scale} ms. Arrow keys move along the notes; Enter chooses one.
      </figcaption>
      <div className="overflow-x-auto pb-2">
        <ol className="flex w-max gap-1" aria-label="Notes of the take">
          {readings.map((r, i) => {
            const look = LOOK[r.verdict];
            const newMeasure = i === 0 || readings[i - 1].measure !== r.measure;
            const x = r.offsetMs === null ? null : Math.max(-1, Math.min(1, r.offsetMs / scale));
            return (
              <li key={r.index} className={`flex ${newMeasure && i > 0 ? 'ml-2 border-l border-line pl-2' : ''}`}>
                <button
                  type="button"
                  ref={(el) => {
                    buttons.current[i] = el;
                  }}
                  tabIndex={i === focusable ? 0 : -1}
                  aria-pressed={selected === r.index}
                  title={readingWords(r)}
                  data-note-index={r.index}
                  data-verdict={r.verdict}
                  onClick={() => onSelect(r.index)}
                  onKeyDown={(e) => onKey(e, i)}
                  className={`relative grid w-12 gap-0.5 rounded-lg border px-1 py-1 text-center focus-visible:outline-2 focus-visible:outline-offset-2 ${
                    selected === r.index ? 'border-dusk-500 bg-dusk-100 dark:bg-dusk-700' : 'border-line bg-raised'
                  }`}
                >
                  <span className="sr-only">{`${readingWords(r)}${pinned?.has(r.index) ? '; has a remark' : ''}`}</span>
                  <span className="text-caption font-semibold" aria-hidden="true">
                    {r.written}
                  </span>
                  <span className={`text-caption font-bold ${look.cls}`} aria-hidden="true">
                    {r.played ?? look.glyph}
                  </span>
                  <svg viewBox="-10 0 20 6" className="h-2 w-full" aria-hidden="true">
                    <line x1="-10" x2="10" y1="3" y2="3" stroke="currentColor" strokeOpacity="0.25" />
                    <line x1="0" x2="0" y1="0" y2="6" stroke="currentColor" strokeOpacity="0.5" />
                    {x !== null ? (
                      <rect x={x * 9 - 1} y="0" width="2" height="6" className={look.cls} fill="currentColor" />
                    ) : null}
                  </svg>
                  {pinned?.has(r.index) ? (
                    <span
                      className="absolute -right-1 -top-1 h-2.5 w-2.5 rounded-full border border-raised bg-dusk-500"
                      aria-hidden="true"
                    />
                  ) : null}
                </button>
              </li>
            );
          })}
        </ol>
      </div>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-caption" aria-label="Key to the marks">
        {(Object.keys(LOOK) as Verdict[]).map((v) => (
          <li key={v}>
            <span className={`font-bold ${LOOK[v].cls}`} aria-hidden="true">
              {LOOK[v].glyph}
            </span>{' '}
            {LOOK[v].word}
          </li>
        ))}
        <li>
          <span className="font-bold text-ember-700 dark:text-ember-100">G4</span> the note played instead
        </li>
        <li>
          <span className="inline-block h-2.5 w-2.5 rounded-full bg-dusk-500 align-middle" aria-hidden="true" /> a
          remark is pinned
        </li>
      </ul>
    </figure>
  );
}
