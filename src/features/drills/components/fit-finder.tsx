import { type ChordFit, EngineError, pairsForChord } from '@shared/engine';
import { type FormEvent, useId, useMemo, useState } from 'react';
import { Button } from '@/components/ui/button';

type Found = { chord: string; fits: ChordFit[]; error: null } | { chord: string; fits: []; error: string };

function find(chord: string): Found {
  try {
    return { chord, fits: pairsForChord(chord), error: null };
  } catch (err) {
    if (err instanceof EngineError) return { chord, fits: [], error: err.message };
    throw err;
  }
}

const SHOWN = 8;

/**
 * The fit finder: a chord symbol in, the pairs whose six notes fit it out, best first, with
 * each note's function against the chord.
 */
export function FitFinder({
  initialChord,
  onPick,
}: {
  initialChord: string;
  onPick: (fit: ChordFit, chord: string) => void;
}) {
  const [text, setText] = useState(initialChord);
  const [asked, setAsked] = useState<string | null>(null);
  const [all, setAll] = useState(false);
  const found = useMemo(() => (asked ? find(asked) : null), [asked]);
  const inputId = useId();
  const errorId = `${inputId}-error`;

  function submit(e: FormEvent) {
    e.preventDefault();
    setAll(false);
    setAsked(text.trim() || ' ');
  }

  const fits = found?.fits ?? [];
  const shown = all ? fits : fits.slice(0, SHOWN);
  return (
    <section aria-labelledby="fit-finder-heading" className="grid gap-3">
      <h2 id="fit-finder-heading" className="text-lead font-bold">
        Fit finder
      </h2>
      <form onSubmit={submit} className="flex flex-wrap items-end gap-2" aria-label="Find pairs for a chord">
        <div className="grid flex-1 gap-1">
          <label htmlFor={inputId} className="text-body font-semibold">
            Chord symbol
          </label>
          <input
            id={inputId}
            value={text}
            onChange={(e) => setText(e.target.value)}
            placeholder="D7, Bbm7, Cmaj7#11 …"
            autoComplete="off"
            spellCheck={false}
            aria-invalid={found?.error ? true : undefined}
            aria-describedby={found?.error ? errorId : undefined}
            className={`rounded-lg border bg-raised px-3 py-2 text-body text-text ${found?.error ? 'border-ember-500' : 'border-line'}`}
          />
        </div>
        <Button type="submit">Find pairs</Button>
      </form>
      {found?.error ? (
        <p id={errorId} role="alert" className="text-caption font-semibold text-ember-700 dark:text-ember-100">
          {found.chord.trim() ? found.error : 'Type a chord symbol first, such as D7.'}
        </p>
      ) : null}
      {found && !found.error ? (
        <div className="grid gap-2">
          <p className="text-caption text-muted" role="status">
            {fits.length} pairs fit {found.chord}, best first: those holding its third and seventh lead.
          </p>
          <ol className="grid gap-2" aria-label={`Pairs for ${found.chord}`}>
            {shown.map((fit) => (
              <li
                key={`${fit.pair.a.symbol}/${fit.pair.b.symbol}`}
                className="flex flex-wrap items-center gap-x-3 gap-y-2 rounded-lg border border-line bg-surface p-3"
                data-testid="fit"
              >
                <span className="w-6 text-caption font-bold text-muted">{fit.rank}</span>
                <span className="min-w-24 font-bold">
                  <span className="text-dusk-700 dark:text-dusk-100">{fit.pair.a.symbol}</span> /{' '}
                  <span className="text-brass-700 dark:text-brass-300">{fit.pair.b.symbol}</span>
                </span>
                <span className="flex-1 text-caption text-muted">{fit.scale}</span>
                <span className="order-last flex basis-full flex-wrap gap-1">
                  <span className="sr-only">Notes and their functions: </span>
                  {fit.pair.hexatonic.map((pc, i) => (
                    <span key={pc} className="rounded border border-line px-1.5 text-caption">
                      {pc} <span className="font-bold">{fit.functions[i]}</span>
                    </span>
                  ))}
                </span>
                <Button
                  variant="quiet"
                  onClick={() => onPick(fit, found.chord)}
                  aria-label={`Use ${fit.pair.a.symbol} / ${fit.pair.b.symbol}`}
                >
                  Use this pair
                </Button>
              </li>
            ))}
          </ol>
          {fits.length > SHOWN ? (
            <Button variant="quiet" onClick={() => setAll(!all)} className="justify-self-start">
              {all ? `Show the first ${SHOWN}` : `Show all ${fits.length}`}
            </Button>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}
