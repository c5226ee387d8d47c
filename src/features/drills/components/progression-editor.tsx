import { type ChordChange, type Drill, EngineError, pairsForChord } from '@shared/engine';
import { chartOf, parseChart, STARTING_PROGRESSIONS } from '@shared/practice/progressions';
import type { FieldErrors } from '@shared/schemas/drills';
import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { SelectField } from '@/components/ui/select-field';
import { CheckboxField } from '@/components/ui/check-field';
import { NumberField } from '@/components/ui/number-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import type { Draft, DrillForm } from '../hooks/use-drill-draft';

/** Fits offered for pinning a chord's pair. */
const PIN_CHOICES = 8;
const LINE = 'line';

const pairText = (p: readonly [string, string] | readonly string[]) => `${p[0]} / ${p[1]}`;

const fitCache = new Map<string, [string, string][]>();

/** A chord's first fits as pairs (kept: typing and pinning ask for the same chords again). */
function fitsOf(chord: string): [string, string][] {
  const hit = fitCache.get(chord);
  if (hit) return hit;
  let fits: [string, string][] = [];
  try {
    fits = pairsForChord(chord)
      .slice(0, PIN_CHOICES)
      .map((f) => [f.pair.a.symbol, f.pair.b.symbol]);
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
  }
  fitCache.set(chord, fits);
  return fits;
}

/** "Dm7 G7 Cmaj7 (3 chords)": a progression drill's title. */
export function progressionTitle(drill: Drill): string {
  const chords = (drill.spec.changes ?? []).map((c) => c.chord);
  const shown = chords.length > 6 ? [...chords.slice(0, 6), '…'] : chords;
  const times = drill.spec.choruses && drill.spec.choruses > 1 ? `, ${drill.spec.choruses} choruses` : '';
  return `${shown.join(' ')} (${chords.length} chord${chords.length === 1 ? '' : 's'}${times})`;
}

/**
 * The progression editor: play the drill through a progression typed as bars of chord symbols
 * or picked from Sixfold's starting progressions, with each chord's pair shown and pinnable.
 * `drill` is the drill in the spec's own key (the pairs the line chose).
 */
export function ProgressionEditor({
  form,
  draft,
  update,
  drill,
  fields,
}: {
  form: DrillForm;
  draft: Draft;
  update: (patch: Partial<Draft>) => void;
  drill: Drill | undefined;
  fields: FieldErrors;
}) {
  const on = draft.changes !== null;
  const [text, setText] = useState(() =>
    draft.changes ? chartOf(draft.changes, draft.meter) : STARTING_PROGRESSIONS[0].chart,
  );
  const [error, setError] = useState<string | null>(null);
  const toggleId = useId();
  const chartId = useId();
  const changesRef = useRef(draft.changes);
  changesRef.current = draft.changes;
  // the changes this editor set last: any others came from outside (a saved drill opened)
  const mine = useRef(draft.changes);
  const setChanges = (changes: ChordChange[] | null) => {
    mine.current = changes;
    update({ changes });
  };
  // The form hands back copies of the values, so they are compared as JSON.
  const changesKey = JSON.stringify(draft.changes);
  // biome-ignore lint/correctness/useExhaustiveDependencies: only changes from outside rewrite the bars
  useEffect(() => {
    if (draft.changes && changesKey !== JSON.stringify(mine.current)) {
      mine.current = draft.changes;
      setText(chartOf(draft.changes, draft.meter));
      setError(null);
    }
  }, [changesKey]);

  function apply(chart: string, meter = draft.meter) {
    setText(chart);
    try {
      const changes = parseChart(chart, meter, changesRef.current ?? []);
      setError(null);
      setChanges(changes);
    } catch (err) {
      if (!(err instanceof EngineError)) throw err;
      setError(err.message);
    }
  }

  // a new meter shares the bars out again
  const meterKey = draft.meter.join('/');
  const lastMeter = useRef(meterKey);
  // biome-ignore lint/correctness/useExhaustiveDependencies: only the meter triggers a re-read
  useEffect(() => {
    if (lastMeter.current === meterKey) return;
    lastMeter.current = meterKey;
    if (on) apply(text);
  }, [meterKey]);

  const problems = Object.entries(fields)
    .filter(([f]) => f === 'changes' || f.startsWith('changes.') || f === 'choruses')
    .flatMap(([, m]) => m);
  const played = drill?.changes ?? [];

  return (
    <section aria-labelledby={`${toggleId}-heading`} className="grid content-start gap-3" data-testid="progression">
      <h2 id={`${toggleId}-heading`} className="text-lead font-bold">
        Over changes
      </h2>
      <CheckboxField
        id={toggleId}
        label="Play the pattern through a progression, a pair for each chord"
        checked={on}
        onChange={(e) => {
          if (e.target.checked) apply(text);
          else setChanges(null);
        }}
      />
      {on ? (
        <>
          <div className="grid items-end gap-3 sm:grid-cols-[2fr_1fr]">
            <SelectField
              label="Start from"
              value=""
              options={[
                { value: '', label: 'A progression of ours…' },
                ...STARTING_PROGRESSIONS.map((p) => ({ value: p.id, label: p.name })),
              ]}
              onChange={(e) => {
                const p = STARTING_PROGRESSIONS.find((s) => s.id === e.target.value);
                if (p) apply(p.chart);
              }}
            />
            <NumberField label="Choruses" min={1} max={16} {...form.register('choruses', { valueAsNumber: true })} />
          </div>
          <div className="grid gap-1">
            <TextAreaField
              id={chartId}
              label="Bars"
              rows={3}
              value={text}
              spellCheck={false}
              hint="Chord symbols between bar lines: two chords in a bar share it, % repeats the bar before."
              aria-invalid={error ? true : undefined}
              onChange={(e) => apply(e.target.value)}
              inputClassName="font-mono"
              data-testid="progression-chart"
            />
            {error || problems.length > 0 ? (
              <p
                role="alert"
                className="text-caption font-semibold text-ember-700 dark:text-ember-100"
                data-testid="progression-error"
              >
                {error ?? problems.join(' ')}
              </p>
            ) : null}
          </div>
          <ChordPairs changes={draft.changes ?? []} played={played} setChanges={setChanges} />
        </>
      ) : null}
    </section>
  );
}

/** Each chord with the pair it is played in; pin another of its fits, or let the line choose. */
function ChordPairs({
  changes,
  played,
  setChanges,
}: {
  changes: ChordChange[];
  played: NonNullable<Drill['changes']>;
  setChanges: (changes: ChordChange[]) => void;
}) {
  const chordsKey = changes.map((c) => c.chord).join('|');
  // biome-ignore lint/correctness/useExhaustiveDependencies: the chords, compared as text
  const fits = useMemo(() => changes.map((c) => fitsOf(c.chord)), [chordsKey]);
  if (changes.length === 0) return null;
  const pin = (i: number, value: string) => {
    const next = changes.map((c, k) => {
      if (k !== i) return c;
      const { pair: _drop, ...rest } = c;
      if (value === LINE) return rest;
      const [a, b] = value.split('|');
      return { ...rest, pair: [a, b] as [string, string] };
    });
    setChanges(next);
  };
  return (
    <ol className="grid gap-2 sm:grid-cols-2" aria-label="Pairs for each chord">
      {changes.map((c, i) => {
        const chosen = played[i]?.pair;
        const options = [
          {
            value: LINE,
            label: chosen && !c.pair ? `Nearest to the line: ${pairText(chosen)}` : 'Nearest to the line',
          },
          ...fits[i].map((p) => ({ value: p.join('|'), label: `Pinned: ${pairText(p)}` })),
        ];
        if (c.pair && !options.some((o) => o.value === c.pair?.join('|'))) {
          options.push({ value: c.pair.join('|'), label: `Pinned: ${pairText(c.pair)}` });
        }
        return (
          <li key={i} className="rounded-lg border border-line p-2" data-testid="progression-chord">
            <SelectField
              label={`${i + 1}. ${c.chord}, ${c.beats} beat${c.beats === 1 ? '' : 's'}`}
              value={c.pair ? c.pair.join('|') : LINE}
              options={options}
              onChange={(e) => pin(i, e.target.value)}
            />
          </li>
        );
      })}
    </ol>
  );
}
