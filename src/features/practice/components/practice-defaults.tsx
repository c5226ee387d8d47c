import { instruments } from '@shared/engine';
import type { PlayerSettings } from '@shared/schemas/settings';
import { useEffect, useRef, useState } from 'react';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { RangeFields } from '@/components/range/range-fields';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/check-field';
import { FormMessage } from '@/components/ui/form-message';
import { NumberField } from '@/components/ui/number-field';
import { SelectField } from '@/components/ui/select-field';
import { useUpdateSettings } from '../api/settings';
import { pitchFrame } from '../lib/pitch-frame';
import { PitchLabel } from './pitch-label';

/** The new values, with every field the player changed from `was` kept as they left it. */
export function keepEdits<T extends object>(draft: T, was: T, next: T): T {
  const out: T = { ...next };
  for (const key of Object.keys(draft) as Array<keyof T>) {
    if (JSON.stringify(draft[key]) !== JSON.stringify(was[key])) Object.assign(out, { [key]: draft[key] });
  }
  return out;
}

type Values = Pick<PlayerSettings, 'instrument' | 'writtenPitchInput' | 'octaveShift' | 'defaultTempo' | 'range'>;

const valuesOf = (s: PlayerSettings): Values => ({
  instrument: s.instrument,
  writtenPitchInput: s.writtenPitchInput,
  octaveShift: s.octaveShift,
  defaultTempo: s.defaultTempo,
  range: s.range,
});

const SHIFTS = [-2, -1, 0, 1, 2].map((o) => ({
  value: String(o),
  label: o === 0 ? 'None' : `${o > 0 ? '+' : ''}${o} octave${Math.abs(o) > 1 ? 's' : ''}`,
}));

const INSTRUMENTS = Object.entries(instruments).map(([id, i]) => ({ value: id, label: i.label }));

/**
 * The settings every drill starts from, kept on the server: instrument, written-pitch input,
 * octave shift of the keyboard, personal range and default tempo.
 */
export function PracticeDefaults({ settings }: { settings: PlayerSettings }) {
  const update = useUpdateSettings();
  const form = useSchemaForm(() => import('@shared/schemas/settings').then((m) => m.UpdateSettingsInput), {
    defaultValues: valuesOf(settings),
  });
  const [done, setDone] = useState(false);
  // The settings the form last started from: fresh settings (a latency just measured, another
  // tab) replace only the fields the player has not changed, so no typing is lost.
  const base = useRef(settings);
  useEffect(() => {
    const was = base.current;
    if (was === settings) return;
    base.current = settings;
    form.reset(keepEdits(form.getValues() as Values, valuesOf(was), valuesOf(settings)));
  }, [settings, form]);
  const draft = form.watch() as Values;
  const inst = instruments[draft.instrument];
  const frame = pitchFrame(draft.instrument);
  // The range typed last, back when "narrower" is ticked again.
  const lastRange = useRef(settings.range);
  const range = draft.range ?? lastRange.current ?? inst.range;

  const submit = form.handleSubmit((input) => {
    setDone(false);
    update.mutate(input, { onSuccess: () => setDone(true), onError: form.fromError });
  });

  return (
    <details className="rounded-card border border-line bg-raised p-4">
      <summary className="cursor-pointer text-lead font-bold">My practice settings</summary>
      <form onSubmit={submit} className="mt-3 grid gap-4" aria-label="My practice settings" noValidate>
        <div className="flex flex-wrap gap-4">
          <SelectField
            label="Instrument"
            options={INSTRUMENTS}
            errors={form.errorsOf('instrument')}
            {...form.register('instrument', {
              // Another instrument starts from its own range.
              onChange: (e) => {
                lastRange.current = null;
                if (form.getValues('range'))
                  form.setValue('range', instruments[e.target.value as Values['instrument']].range);
              },
            })}
          />
          <NumberField
            label="Default tempo (bpm)"
            className="w-44"
            min={20}
            max={400}
            errors={form.errorsOf('defaultTempo')}
            {...form.register('defaultTempo', { valueAsNumber: true })}
          />
          <SelectField
            label="Keyboard octave shift"
            options={SHIFTS}
            errors={form.errorsOf('octaveShift')}
            {...form.register('octaveShift', { setValueAs: Number })}
          />
        </div>
        <CheckboxField
          label={`My keyboard plays written pitch for ${inst.label}`}
          errors={form.errorsOf('writtenPitchInput')}
          {...form.register('writtenPitchInput')}
        />
        <fieldset className="flex flex-wrap items-end gap-4">
          <legend className="text-caption font-semibold">My range (drills stay inside it)</legend>
          <CheckboxField
            label={
              <span>
                Narrower than the instrument's <PitchLabel frame={frame} midi={inst.range.low} />–
                <PitchLabel frame={frame} midi={inst.range.high} />
              </span>
            }
            checked={draft.range !== null}
            onChange={(e) => {
              if (!e.target.checked) lastRange.current = draft.range;
              form.setValue('range', e.target.checked ? range : null, { shouldDirty: true });
            }}
          />
          {draft.range ? (
            <RangeFields
              instrument={draft.instrument}
              range={draft.range}
              onChange={(r) => form.setValue('range', r, { shouldDirty: true })}
              lowErrors={form.errorsOf('range.low') ?? form.errorsOf('range')}
              highErrors={form.errorsOf('range.high')}
            />
          ) : null}
        </fieldset>
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" disabled={update.isPending}>
            {update.isPending ? 'Saving…' : 'Save my settings'}
          </Button>
          <p role="status" className="text-body">
            {done ? 'Saved. New drills start from these.' : ''}
          </p>
        </div>
        {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      </form>
    </details>
  );
}
