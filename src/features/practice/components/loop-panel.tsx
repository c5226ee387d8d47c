import { useEffect, useId, useRef } from 'react';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { NumberField } from '@/components/ui/number-field';
import type { LoopState } from '../hooks/use-loop';

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
  const limits = useRef({ measures, targetTempo });
  limits.current = { measures, targetTempo };
  const form = useSchemaForm(() => import('@shared/schemas/practice').then((m) => m.loopInput(() => limits.current)), {
    mode: 'onChange',
    defaultValues: { from: 1, to: Math.min(2, measures), tempo: Math.max(20, Math.round(targetTempo * 0.8)) },
  });
  // A shorter drill or a slower tempo pulls the passage inside it.
  // biome-ignore lint/correctness/useExhaustiveDependencies: only a new drill moves the passage
  useEffect(() => {
    const v = form.getValues();
    if (v.from > measures) form.setValue('from', measures);
    if (v.to > measures) form.setValue('to', measures);
    if (v.tempo > targetTempo) form.setValue('tempo', targetTempo);
    if (Object.keys(form.formState.errors).length > 0) void form.trigger();
  }, [measures, targetTempo]);
  const invalid = Object.keys(form.formState.errors).length > 0;
  const submit = form.handleSubmit((v) => onStart(v.from, v.to, v.tempo));

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
      onSubmit={submit}
      noValidate
    >
      <h2 id={`${id}-h`} className="text-lead font-bold">
        Loop a passage
      </h2>
      <fieldset disabled={disabled} className="flex flex-wrap items-start gap-4">
        <NumberField
          label="From measure"
          className="w-32"
          min={1}
          max={measures}
          errors={form.errorsOf('from')}
          {...form.register('from', { valueAsNumber: true, deps: ['to'] })}
        />
        <NumberField
          label="To measure"
          className="w-32"
          min={1}
          max={measures}
          errors={form.errorsOf('to')}
          {...form.register('to', { valueAsNumber: true, deps: ['from'] })}
        />
        <NumberField
          label="Loop tempo (bpm)"
          className="w-36"
          min={20}
          max={targetTempo}
          errors={form.errorsOf('tempo')}
          {...form.register('tempo', { valueAsNumber: true })}
        />
        <Button type="submit" className="self-end" disabled={invalid}>
          Loop these measures
        </Button>
      </fieldset>
      <p className="text-caption text-muted">
        Each pass is counted in and saved as a take; after a clean pass the tempo climbs toward {targetTempo} bpm.
      </p>
    </form>
  );
}
