import { type InstrumentId, instruments, PRESET_IDS, presets } from '@shared/engine';
import { type CustomPattern, type FieldErrors, METERS } from '@shared/schemas/drills';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import type { Draft, DrillForm } from '../hooks/use-drill-draft';
import { NEW_TRIAD_PATTERN } from './pattern-form';
import { RangeFields } from '@/components/range/range-fields';

const INSTRUMENT_OPTIONS = (Object.keys(instruments) as InstrumentId[]).map((id) => ({
  value: id,
  label: instruments[id].label,
}));
const METER_OPTIONS = METERS.map(([n, d]) => ({ value: `${n}/${d}`, label: `${n}/${d}` }));
const pick = (fields: FieldErrors, ...keys: string[]) => {
  const out = keys.flatMap((k) =>
    Object.entries(fields)
      .filter(([f]) => f === k || f.startsWith(`${k}.`))
      .flatMap(([, v]) => v),
  );
  return out.length ? out : undefined;
};

/** JSON with keys in one order (PostgreSQL's jsonb gives them back in its own). */
function canonical(value: unknown): string {
  return JSON.stringify(value, (_k, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => a.localeCompare(b)))
      : v,
  );
}

/** The pattern choice: a preset, one of the saved patterns, or a custom one built in the form. */
export function patternValue(draft: Draft, saved: CustomPattern[]): string {
  if (typeof draft.pattern === 'string') return draft.pattern;
  const def = canonical(draft.pattern);
  const match = saved.find((p) => canonical(p.def) === def);
  return match ? `saved:${match.id}` : 'custom';
}

/**
 * Pair, pattern, direction, instrument, range, tempo, meter and key-cycle order: the typed and
 * chosen values are the drill form's own fields; `fields` holds the schema's and engine's messages.
 */
export function DrillSettings({
  form,
  draft,
  update,
  fields,
  savedPatterns,
}: {
  form: DrillForm;
  draft: Draft;
  update: (patch: Partial<Draft>) => void;
  fields: FieldErrors;
  savedPatterns: CustomPattern[];
}) {
  const range = draft.range ?? instruments[draft.instrument].drillRange;
  // Over a progression each chord brings its own pair and the pad plays the changes.
  const progression = draft.changes !== null;
  const patternOptions = [
    ...PRESET_IDS.map((id) => ({ value: id, label: presets[id].name })),
    ...savedPatterns.map((p) => ({ value: `saved:${p.id}`, label: `${p.name}${p.mine ? '' : ` — ${p.owner.name}`}` })),
    { value: 'custom', label: 'Custom: build one…' },
  ];
  return (
    <section aria-labelledby="settings-heading" className="grid content-start gap-4">
      <h2 id="settings-heading" className="text-lead font-bold">
        The drill
      </h2>
      {progression ? (
        <p className="text-caption text-muted" data-testid="progression-sets-pair">
          The progression sets the pair for each chord, and the pad plays its chords. Turn the progression off to choose
          one pair and a chord for the pad.
        </p>
      ) : (
        <div className="grid items-start gap-3 sm:grid-cols-2">
          <TextField className="min-w-0" label="Triad a" errors={pick(fields, 'pair.0')} {...form.register('pair.0')} />
          <TextField className="min-w-0" label="Triad b" errors={pick(fields, 'pair.1')} {...form.register('pair.1')} />
        </div>
      )}
      {fields.pair && !progression ? (
        <p
          role="alert"
          className="text-caption font-semibold text-ember-700 dark:text-ember-100"
          data-testid="pair-error"
        >
          {fields.pair.join(' ')}
        </p>
      ) : null}
      <div className="grid items-start gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <SelectField
          label="Pattern"
          value={patternValue(draft, savedPatterns)}
          options={patternOptions}
          errors={typeof draft.pattern === 'string' ? pick(fields, 'pattern') : undefined}
          onChange={(e) => {
            const v = e.target.value;
            if (v === 'custom')
              update({ pattern: typeof draft.pattern === 'string' ? { ...NEW_TRIAD_PATTERN } : draft.pattern });
            else if (v.startsWith('saved:'))
              update({ pattern: savedPatterns.find((p) => `saved:${p.id}` === v)?.def ?? draft.pattern });
            else update({ pattern: v as Draft['pattern'] });
          }}
        />
        <SelectField
          label="Direction"
          errors={pick(fields, 'direction')}
          options={[
            { value: 'up', label: 'Up' },
            { value: 'down', label: 'Down' },
            { value: 'up-down', label: 'Up, then down' },
          ]}
          {...form.register('direction')}
        />
        <SelectField
          label="Instrument"
          options={INSTRUMENT_OPTIONS}
          errors={pick(fields, 'instrument')}
          {...form.register('instrument', {
            // A new instrument brings its own range.
            onChange: () => form.setValue('range', null),
          })}
        />
        <RangeFields
          instrument={draft.instrument}
          range={range}
          onChange={(r) => update({ range: r })}
          lowErrors={pick(fields, 'range.low', 'range')}
          highErrors={pick(fields, 'range.high')}
        />
        <TextField
          className="min-w-0"
          label="Tempo (quarter notes per minute)"
          type="number"
          min={20}
          max={400}
          errors={pick(fields, 'tempo')}
          {...form.register('tempo', { valueAsNumber: true })}
        />
        <SelectField
          label="Meter"
          value={`${draft.meter[0]}/${draft.meter[1]}`}
          options={METER_OPTIONS}
          errors={pick(fields, 'meter')}
          onChange={(e) => update({ meter: e.target.value.split('/').map(Number) as [number, number] })}
        />
        <SelectField
          label="Key cycle order"
          options={[
            { value: 'chromatic', label: 'Chromatic' },
            { value: 'fourths', label: 'Fourths' },
            { value: 'fifths', label: 'Fifths' },
          ]}
          {...form.register('order')}
        />
        {progression ? null : (
          <TextField
            className="min-w-0"
            label="Chord (for the pad)"
            errors={pick(fields, 'chord')}
            placeholder="none"
            {...form.register('chord')}
          />
        )}
      </div>
      {fields.start ? (
        <p role="alert" className="text-caption font-semibold text-ember-700 dark:text-ember-100">
          {fields.start.join(' ')}
        </p>
      ) : null}
    </section>
  );
}
