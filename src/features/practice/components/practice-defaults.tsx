import { type InstrumentId, instruments } from '@shared/engine';
import type { PlayerSettings } from '@shared/schemas/settings';
import { type FormEvent, useEffect, useRef, useState } from 'react';
import { RangeFields } from '@/components/range/range-fields';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';
import { useUpdateSettings } from '../api/settings';
import { pitchFrame } from '../lib/pitch-frame';
import { PitchLabel } from './pitch-label';

const field = 'mt-1 rounded-md border border-line bg-surface px-2 py-1.5 text-body';

/** The new settings, with every field the player changed from `was` kept as they left it. */
export function keepEdits(draft: PlayerSettings, was: PlayerSettings, next: PlayerSettings): PlayerSettings {
  const out: PlayerSettings = { ...next };
  for (const key of Object.keys(draft) as Array<keyof PlayerSettings>) {
    if (JSON.stringify(draft[key]) !== JSON.stringify(was[key])) Object.assign(out, { [key]: draft[key] });
  }
  return out;
}

/**
 * The settings every drill starts from, kept on the server: instrument, written-pitch input,
 * octave shift of the keyboard, personal range and default tempo.
 */
export function PracticeDefaults({ settings }: { settings: PlayerSettings }) {
  const update = useUpdateSettings();
  const [draft, setDraft] = useState(settings);
  const [useRange, setUseRange] = useState(settings.range !== null);
  const [done, setDone] = useState(false);
  // The settings the form last started from: fresh settings (a latency just measured, another
  // tab) replace only the fields the player has not changed, so no typing is lost.
  const base = useRef(settings);
  useEffect(() => {
    const was = base.current;
    base.current = settings;
    setDraft((d) => keepEdits(d, was, settings));
    setUseRange((u) => (u === (was.range !== null) ? settings.range !== null : u));
  }, [settings]);
  const inst = instruments[draft.instrument];
  const frame = pitchFrame(draft.instrument);
  const range = draft.range ?? inst.range;
  const errors = update.error instanceof ApiError ? (update.error.fields ?? {}) : {};

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setDone(false);
    update.mutate(
      {
        instrument: draft.instrument,
        writtenPitchInput: draft.writtenPitchInput,
        octaveShift: draft.octaveShift,
        defaultTempo: draft.defaultTempo,
        range: useRange ? range : null,
      },
      { onSuccess: () => setDone(true) },
    );
  };

  return (
    <details className="rounded-card border border-line bg-raised p-4">
      <summary className="cursor-pointer text-lead font-bold">My practice settings</summary>
      <form onSubmit={submit} className="mt-3 grid gap-4" aria-label="My practice settings">
        <div className="flex flex-wrap gap-4">
          <label className="flex flex-col text-caption font-semibold">
            Instrument
            <select
              className={field}
              value={draft.instrument}
              onChange={(e) => setDraft({ ...draft, instrument: e.target.value as InstrumentId, range: null })}
            >
              {Object.entries(instruments).map(([id, i]) => (
                <option key={id} value={id}>
                  {i.label}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col text-caption font-semibold">
            Default tempo (bpm)
            <input
              className={`${field} w-24`}
              type="number"
              min={20}
              max={400}
              value={draft.defaultTempo}
              onChange={(e) => setDraft({ ...draft, defaultTempo: Number(e.target.value) })}
              aria-invalid={errors.defaultTempo ? true : undefined}
            />
          </label>
          <label className="flex flex-col text-caption font-semibold">
            Keyboard octave shift
            <select
              className={field}
              value={draft.octaveShift}
              onChange={(e) => setDraft({ ...draft, octaveShift: Number(e.target.value) })}
            >
              {[-2, -1, 0, 1, 2].map((o) => (
                <option key={o} value={o}>
                  {o === 0 ? 'None' : `${o > 0 ? '+' : ''}${o} octave${Math.abs(o) > 1 ? 's' : ''}`}
                </option>
              ))}
            </select>
          </label>
        </div>
        <label className="flex items-center gap-2 text-body">
          <input
            type="checkbox"
            className="h-4 w-4 accent-brass-600"
            checked={draft.writtenPitchInput}
            onChange={(e) => setDraft({ ...draft, writtenPitchInput: e.target.checked })}
          />
          My keyboard plays written pitch for {inst.label}
        </label>
        <fieldset className="flex flex-wrap items-end gap-4">
          <legend className="text-caption font-semibold">My range (drills stay inside it)</legend>
          <label className="flex items-center gap-2 text-body">
            <input
              type="checkbox"
              className="h-4 w-4 accent-brass-600"
              checked={useRange}
              onChange={(e) => setUseRange(e.target.checked)}
            />
            Narrower than the instrument's <PitchLabel frame={frame} midi={inst.range.low} />–
            <PitchLabel frame={frame} midi={inst.range.high} />
          </label>
          {useRange ? (
            <RangeFields
              instrument={draft.instrument}
              range={range}
              onChange={(r) => setDraft({ ...draft, range: r })}
              lowErrors={errors['range.low'] ?? errors.range}
              highErrors={errors['range.high']}
            />
          ) : null}
        </fieldset>
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" disabled={update.isPending}>
            {update.isPending ? 'Saving…' : 'Save my settings'}
          </Button>
          <p role="status" className="text-body">
            {done ? 'Saved. New drills start from these.' : ''}
            {update.error ? `Not saved: ${update.error.message} ${Object.values(errors).flat().join(' ')}` : ''}
          </p>
        </div>
      </form>
    </details>
  );
}
