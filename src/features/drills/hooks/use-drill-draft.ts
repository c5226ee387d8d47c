import { type Drill, EngineError, inAllKeys, type InstrumentId, instruments } from '@shared/engine';
import { generateChecked } from '@shared/engine/patterns/checked';
import { type ChordChange, DrillSpec, type FieldErrors, type KeyOrder } from '@shared/schemas/drills';
import { useEffect, useMemo, useRef } from 'react';
import { useWatch } from 'react-hook-form';
import { z } from 'zod';
import { type SchemaForm, useSchemaForm } from '@/components/form/use-schema-form';

/** What the form holds: a DrillSpec with the instrument's range standing in until one is set. */
export interface Draft {
  pair: [string, string];
  pattern: DrillSpec['pattern'];
  direction: DrillSpec['direction'];
  instrument: InstrumentId;
  range: { low: number; high: number } | null;
  tempo: number;
  meter: [number, number];
  chord: string;
  order: KeyOrder;
  /** a progression to play the pattern through (the pair then stands aside), or null */
  changes: ChordChange[] | null;
  choruses: number;
}

/** The demo world's first drill: D/C over D7, four-three, for alto sax. */
export const DEFAULT_DRAFT: Draft = {
  pair: ['D', 'C'],
  pattern: 'four-three',
  direction: 'up',
  instrument: 'alto-sax',
  range: null,
  tempo: 100,
  meter: [4, 4],
  chord: 'D7',
  order: 'chromatic',
  changes: null,
  choruses: 1,
};

export function draftFromSpec(spec: DrillSpec, order: KeyOrder): Draft {
  return {
    pair: spec.pair ?? spec.changes?.find((c) => c.pair)?.pair ?? DEFAULT_DRAFT.pair,
    pattern: spec.pattern,
    direction: spec.direction,
    instrument: spec.instrument ?? 'piano',
    range: spec.range ?? null,
    tempo: spec.tempo ?? 120,
    meter: spec.meter ?? [4, 4],
    chord: spec.chord ?? '',
    order,
    changes: spec.changes ?? null,
    choruses: spec.choruses ?? 1,
  };
}

export function specOf(d: Draft): DrillSpec {
  return {
    ...(d.changes ? { changes: d.changes, choruses: d.choruses } : { pair: d.pair }),
    pattern: d.pattern,
    direction: d.direction,
    instrument: d.instrument,
    tempo: d.tempo,
    meter: d.meter,
    ...(d.range ? { range: d.range } : {}),
    // over a progression the chords are the changes themselves
    ...(d.chord.trim() && !d.changes ? { chord: d.chord.trim() } : {}),
  };
}

export interface DraftResult {
  spec: DrillSpec | null;
  /** field -> messages: the engine's reason the drill is impossible (the schema's are the form's) */
  fields: FieldErrors;
  /** the 12 keys of the cycle in the chosen order (empty when the spec has an error) */
  cycle: Drill[];
  cycleError: string | null;
}

/**
 * The form's schema: the draft read as the DrillSpec it stands for, checked by the same schema
 * the server parses, so each refusal lands on the draft's field of the same name.
 */
export function draftSchemaOf(spec: typeof DrillSpec) {
  return z
    .custom<Draft>((v) => typeof v === 'object' && v !== null)
    .transform(specOf)
    .pipe(spec);
}

/** Builds the drill from a draft the schema took: the engine's own refusal, or the key cycle. */
export function evaluateDraft(d: Draft): DraftResult {
  const parsed = DrillSpec.safeParse(specOf(d));
  if (!parsed.success) return { spec: null, fields: {}, cycle: [], cycleError: null };
  const first = generateChecked(parsed.data);
  if (!first.ok) return { spec: parsed.data, fields: first.fields, cycle: [], cycleError: null };
  try {
    return {
      spec: parsed.data,
      fields: {},
      cycle: inAllKeys(parsed.data as Parameters<typeof inAllKeys>[0], d.order),
      cycleError: null,
    };
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    return { spec: parsed.data, fields: {}, cycle: [first.drill], cycleError: err.message };
  }
}

/**
 * react-hook-form's nested errors as `field.path -> messages`.
 *
 * @example
 * flatErrors({ pair: [undefined, { type: 'custom', message: 'Not a triad' }] }) // { 'pair.1': ['Not a triad'] }
 */
export function flatErrors(errors: unknown, prefix = ''): FieldErrors {
  const out: FieldErrors = {};
  if (!errors || typeof errors !== 'object') return out;
  const node = errors as Record<string, unknown>;
  if (typeof node.message === 'string' && node.message !== '') out[prefix || '_'] = [node.message];
  for (const [key, child] of Object.entries(node)) {
    if (key === 'message' || key === 'type' || key === 'ref' || key === 'types' || key === 'root') continue;
    Object.assign(out, flatErrors(child, prefix ? `${prefix}.${key}` : key));
  }
  return out;
}

export type DrillForm = SchemaForm<ReturnType<typeof draftSchemaOf>>;

/**
 * The drill being built on the page: its fields in the form kit (checked as they change by the
 * shared DrillSpec schema), the drill built live from them, the engine's refusals, the key cycle.
 */
export function useDrillDraft(initial: Draft) {
  const form = useSchemaForm(() => import('@shared/schemas/drills').then((m) => draftSchemaOf(m.DrillSpec)), {
    defaultValues: initial,
    mode: 'onChange',
  });
  const draft = useWatch({ control: form.control }) as Draft;
  const key = JSON.stringify(draft);
  // biome-ignore lint/correctness/useExhaustiveDependencies: the values, compared as JSON
  const evaluated = useMemo(() => evaluateDraft(draft), [key]);
  // Every change is checked as a whole: one value can make another wrong (a pair sharing a note).
  // biome-ignore lint/correctness/useExhaustiveDependencies: the values, compared as JSON
  useEffect(() => {
    void form.trigger();
  }, [key]);
  // A value the schema refuses leaves the last drill it took on show.
  const lastGood = useRef<DraftResult | null>(null);
  if (evaluated.spec) lastGood.current = evaluated;
  const shown = evaluated.spec ? evaluated : { ...(lastGood.current ?? evaluated), spec: null };
  // The schema's messages, from the form; once the values parse again any left are stale.
  const schemaFields = evaluated.spec ? {} : flatErrors(form.formState.errors);
  const fields: FieldErrors = { ...schemaFields, ...evaluated.fields };

  const update = (patch: Partial<Draft>) => {
    const newInstrument = patch.instrument !== undefined && patch.instrument !== form.getValues('instrument');
    for (const [name, value] of Object.entries(patch) as Array<[keyof Draft, unknown]>) {
      if (name === 'pair') {
        const [a, b] = value as Draft['pair'];
        form.setValue('pair.0', a);
        form.setValue('pair.1', b);
      } else form.setValue(name, value as never);
    }
    // A new instrument brings its own range.
    if (newInstrument && !patch.range) form.setValue('range', null);
  };
  const setDraft = (d: Draft) => form.reset(d);
  const range = draft.range ?? instruments[draft.instrument].range;
  return { form, draft, update, setDraft, range, ...shown, fields };
}
