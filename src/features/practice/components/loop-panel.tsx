import { useEffect, useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import type { LoopState } from '../hooks/use-loop';

const field = 'mt-1 w-20 rounded-md border border-line bg-surface px-2 py-1.5 text-body';

/**
 * Loop a passage: pick the measures and a slower tempo; every pass is a take, counted in, and
 * the tempo climbs toward the drill's own after each clean pass.
 */
export function LoopPanel({
  measures,
  targetTempo,
  loop,
  disabled,
  onStart,
  onEnd,
}: {
  measures: number;
  targetTempo: number;
  loop: LoopState | null;
  disabled: boolean;
  onStart: (from: number, to: number, tempo: number) => void;
  onEnd: () => void;
}) {
  const id = useId();
  const [from, setFrom] = useState(1);
  const [to, setTo] = useState(Math.min(2, measures));
  const [tempo, setTempo] = useState(Math.max(20, Math.round(targetTempo * 0.8)));
  useEffect(() => {
    setFrom((f) => Math.min(f, measures));
    setTo((t) => Math.min(t, measures));
  }, [measures]);
  useEffect(() => setTempo((t) => Math.min(t, targetTempo)), [targetTempo]);
  const bad =
    from < 1 || to > measures || from > to
      ? `Choose measures between 1 and ${measures}, the first no later than the last.`
      : tempo < 20 || tempo > targetTempo
        ? `Choose a tempo from 20 to the drill's ${targetTempo} bpm.`
        : null;

  if (loop) {
    return (
      <section
        aria-labelledby={`${id}-h`}
        className="flex flex-wrap items-center gap-3 rounded-card border border-line bg-raised p-4"
        data-testid="loop"
        data-from={loop.from}
        data-to={loop.to}
        data-tempo={loop.tempo}
        data-passes={loop.passes}
      >
        <h2 id={`${id}-h`} className="text-lead font-bold">
          Looping measure{loop.from === loop.to ? ` ${loop.from}` : `s ${loop.from}–${loop.to}`}
        </h2>
        <p className="text-body">
          Next pass at <strong>{loop.tempo} bpm</strong>
          {loop.tempo < targetTempo ? `, climbing toward ${targetTempo} bpm` : ", the drill's own tempo"}.{' '}
          {loop.passes === 1 ? '1 pass so far.' : `${loop.passes} passes so far.`}
        </p>
        <Button variant="quiet" onClick={onEnd} disabled={disabled}>
          End the loop
        </Button>
      </section>
    );
  }
  return (
    <form
      aria-labelledby={`${id}-h`}
      className="grid gap-3 rounded-card border border-line bg-raised p-4"
      onSubmit={(e) => {
        e.preventDefault();
        if (!bad) onStart(from, to, tempo);
      }}
    >
      <h2 id={`${id}-h`} className="text-lead font-bold">
        Loop a passage
      </h2>
      <fieldset disabled={disabled} className="flex flex-wrap items-end gap-4">
        <label className="flex flex-col text-caption font-semibold">
          From measure
          <input
            className={field}
            type="number"
            min={1}
            max={measures}
            value={from}
            onChange={(e) => setFrom(Math.round(Number(e.target.value)) || 1)}
          />
        </label>
        <label className="flex flex-col text-caption font-semibold">
          To measure
          <input
            className={field}
            type="number"
            min={1}
            max={measures}
            value={to}
            onChange={(e) => setTo(Math.round(Number(e.target.value)) || 1)}
          />
        </label>
        <label className="flex flex-col text-caption font-semibold">
          Loop tempo (bpm)
          <input
            className={field}
            type="number"
            min={20}
            max={targetTempo}
            value={tempo}
            onChange={(e) => setTempo(Math.round(Number(e.target.value)) || 20)}
          />
        </label>
        <Button type="submit" disabled={bad !== null}>
          Loop these measures
        </Button>
      </fieldset>
      <p className="text-caption text-muted" role={bad ? 'alert' : undefined}>
        {bad ??
          `Each pass is counted in and saved as a take; after a clean pass the tempo climbs toward ${targetTempo} bpm.`}
      </p>
    </form>
  );
}
