import { type Drill, EngineError, inAllKeys, type InstrumentId, instruments } from '@shared/engine';
import { generateChecked } from '@shared/engine/patterns/checked';
import { type ChordChange, DrillSpec, type FieldErrors, type KeyOrder } from '@shared/schemas/drills';
import { useMemo, useState } from 'react';
import { fieldErrors } from '@shared/schemas/field-errors';

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
  /** field -> messages: from the spec's checks, or the engine's reason the drill is impossible */
  fields: FieldErrors;
  /** the 12 keys of the cycle in the chosen order (empty when the spec has an error) */
  cycle: Drill[];
  cycleError: string | null;
}

/** Checks the draft with the same schema and engine call as the server, then builds the cycle. */
export function evaluateDraft(d: Draft): DraftResult {
  const parsed = DrillSpec.safeParse(specOf(d));
  if (!parsed.success) {
    return { spec: null, fields: fieldErrors(parsed.error.issues), cycle: [], cycleError: null };
  }
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

/** The drill being built on the page, its checks, and its key cycle. */
export function useDrillDraft(initial: Draft) {
  const [draft, setDraft] = useState<Draft>(initial);
  const result = useMemo(() => evaluateDraft(draft), [draft]);
  const update = (patch: Partial<Draft>) =>
    setDraft((d) => {
      const next = { ...d, ...patch };
      // A new instrument brings its own range.
      if (patch.instrument && patch.instrument !== d.instrument && !patch.range) next.range = null;
      return next;
    });
  const range = draft.range ?? instruments[draft.instrument].range;
  return { draft, update, setDraft, range, ...result };
}
