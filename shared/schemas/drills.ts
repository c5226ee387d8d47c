import { z } from 'zod';
import { instruments, PRESET_IDS } from '../engine';
import { chordTones } from '../engine/theory/chord-tones';
import type { InstrumentId, PatternId as EnginePatternId } from '../engine';

/**
 * The drill contracts used by the browser and the API alike: a DrillSpec and a PatternDef as
 * the engine reads them, every field checked with a message a player can act on.
 */

const SUBDIVISION = z.enum(['eighth', 'triplet', 'sixteenth'], { error: 'Choose eighths, triplets or sixteenths' });

export const TriadCell = z.object({
  triad: z.enum(['a', 'b'], { error: 'A cell plays triad a or triad b' }),
  notes: z.union([z.literal(3), z.literal(4)], { error: 'A cell holds 3 or 4 notes' }),
  shape: z.enum(['line', 'leap'], { error: 'A cell moves as a line or a leap' }),
  motion: z.enum(['up', 'down'], { error: 'A cell moves up or down' }),
  entry: z.enum(['start', 'above', 'below', 'same-position', 'next-position'], {
    error: 'A cell enters at the start, above, below, at the same position or at the next position',
  }),
});
export type TriadCell = z.infer<typeof TriadCell>;

const PatternName = z
  .string({ error: 'Name the pattern' })
  .trim()
  .min(1, { error: 'Name the pattern' })
  .max(60, { error: 'Keep the name under 60 characters' });

export const TriadPatternDef = z.object({
  name: PatternName,
  subdivision: SUBDIVISION,
  source: z.literal('triads'),
  cells: z
    .array(TriadCell)
    .min(1, { error: 'A pattern needs at least one cell' })
    .max(32, { error: 'A pattern holds at most 32 cells' }),
});

export const ScalePatternDef = z.object({
  name: PatternName,
  subdivision: SUBDIVISION,
  source: z.literal('scale'),
  degrees: z
    .array(z.number().int({ error: 'Degrees are whole numbers' }).min(-48).max(48), {
      error: 'List the degrees as numbers',
    })
    .min(1, { error: 'A scale pattern needs at least one degree' })
    .max(64, { error: 'A scale pattern holds at most 64 notes per cell' }),
  step: z.number({ error: 'The step is a whole number' }).int({ error: 'The step is a whole number' }).min(-24).max(24),
});

export const PatternDef = z.discriminatedUnion('source', [TriadPatternDef, ScalePatternDef], {
  error: 'A pattern is built from the triads or from the six-note scale',
});
export type PatternDef = z.infer<typeof PatternDef>;

export const PatternId = z.enum(PRESET_IDS as [EnginePatternId, ...EnginePatternId[]], {
  error: 'There is no preset pattern by that name',
});

const INSTRUMENT_IDS = Object.keys(instruments) as [InstrumentId, ...InstrumentId[]];
export const InstrumentIdSchema = z.enum(INSTRUMENT_IDS, { error: 'Sixfold has no such instrument' });

/** The meters the engine writes drills in. */
export const METERS = [
  [4, 4],
  [3, 4],
  [5, 4],
  [6, 8],
  [7, 8],
] as const satisfies ReadonlyArray<readonly [number, number]>;

const Midi = z
  .number({ error: 'A MIDI note number' })
  .int({ error: 'A whole MIDI note number' })
  .min(0, { error: 'At least 0' })
  .max(127, { error: 'At most 127' });

const TriadSymbol = z
  .string({ error: 'Name a triad, such as F, Fm, Fdim or Faug' })
  .trim()
  .min(1, { error: 'Name a triad, such as F, Fm, Fdim or Faug' })
  .max(12, { error: 'That is not a triad symbol' });

const PairTuple = z.tuple([TriadSymbol, TriadSymbol], { error: 'A pair is two triad symbols, such as ["D", "C"]' });

/** One chord of a progression: its symbol, its length in quarter notes, and a pair pinned to it. */
export const ChordChange = z.object({
  chord: z
    .string({ error: 'Name the chord, such as Dm7' })
    .trim()
    .min(1, { error: 'Name the chord, such as Dm7' })
    .max(24, { error: 'That chord symbol is too long' })
    .refine((c) => chordTones(c).length > 0, {
      error: (iss) => `"${String(iss.input)}" is not a chord symbol Sixfold can read (try Dm7, G7, Cmaj7)`,
    }),
  beats: z
    .number({ error: 'A chord lasts a number of beats' })
    .positive({ error: 'A chord lasts more than 0 beats' })
    .max(64, { error: 'A chord lasts at most 64 beats' }),
  pair: PairTuple.optional(),
});
export type ChordChange = z.infer<typeof ChordChange>;

export const DrillSpec = z
  .object({
    pair: PairTuple.optional(),
    changes: z
      .array(ChordChange, { error: 'A progression is a list of chords' })
      .min(1, { error: 'A progression needs at least one chord' })
      .max(96, { error: 'A progression holds at most 96 chords' })
      .optional(),
    choruses: z
      .number({ error: 'Choruses is a whole number' })
      .int({ error: 'Choruses is a whole number' })
      .min(1, { error: 'Play the progression at least once' })
      .max(16, { error: 'Play the progression at most 16 times' })
      .optional(),
    pattern: z.union([PatternId, PatternDef], { error: 'Choose a preset pattern or define one' }),
    direction: z.enum(['up', 'down', 'up-down'], { error: 'A drill goes up, down or up-down' }),
    range: z
      .object({ low: Midi, high: Midi })
      .refine((r) => r.low <= r.high, { error: 'The low note must not be above the high note', path: ['low'] })
      .optional(),
    start: Midi.optional(),
    instrument: InstrumentIdSchema.optional(),
    tempo: z
      .number({ error: 'The tempo is a number of beats per minute' })
      .min(20, { error: 'The tempo is at least 20' })
      .max(400, { error: 'The tempo is at most 400' })
      .optional(),
    meter: z
      .tuple([z.number().int(), z.number().int()], { error: 'A meter is two numbers, such as [4, 4]' })
      .refine((m) => METERS.some(([n, d]) => n === m[0] && d === m[1]), { error: 'Choose 4/4, 3/4, 5/4, 6/8 or 7/8' })
      .optional(),
    chord: z
      .string()
      .trim()
      .max(24, { error: 'That chord symbol is too long' })
      .refine((c) => chordTones(c).length > 0, {
        error: 'That is not a chord symbol Sixfold can read (try D7, Bbm7, Cmaj7#11)',
      })
      .optional(),
  })
  .refine((s) => s.pair !== undefined || s.changes !== undefined, {
    error: 'A drill needs a pair of two triads, such as ["D", "C"], or a progression of chords',
    path: ['pair'],
  });
export type DrillSpec = z.infer<typeof DrillSpec>;
/** The same schema under the name request bodies use (takes carry the spec they were played from). */
export const DrillSpecInput = DrillSpec;
export type DrillSpecInput = DrillSpec;

export const KeyOrder = z.enum(['chromatic', 'fourths', 'fifths'], {
  error: 'A key cycle goes chromatic, in fourths or in fifths',
});
export type KeyOrder = z.infer<typeof KeyOrder>;

export type { DrillResult, FieldErrors } from '../engine/patterns/checked';

/** `GET /api/drills/preview?spec=<URL-encoded DrillSpec JSON>` */
export const PreviewQuery = z.object({
  spec: z
    .string({ error: 'Send the drill spec as JSON in ?spec=' })
    .min(2, { error: 'Send the drill spec as JSON in ?spec=' })
    .max(8000, { error: 'The spec is too long' }),
});
export type PreviewQuery = z.infer<typeof PreviewQuery>;
/** One written note of a generated drill. */
export const DrillNote = z.object({
  midi: z.number().int(),
  name: z.string(),
  written: z.string(),
  beat: z.number(),
  duration: z.number(),
  measure: z.number().int(),
  beatInMeasure: z.number(),
  source: z.enum(['a', 'b', 'scale']),
  cell: z.number().int(),
  chordIndex: z.number().int().optional(),
});

/** A generated drill as the preview sends it: its filled-in spec, its notes and, over changes, the chords played. */
export const GeneratedDrill = z.object({
  spec: DrillSpec,
  notes: z.array(DrillNote),
  measures: z.number().int(),
  changes: z
    .array(
      z.object({
        chord: z.string(),
        pair: z.tuple([z.string(), z.string()]),
        startBeat: z.number(),
        beats: z.number(),
      }),
    )
    .optional(),
});

export const PreviewResponse = z.object({ drill: GeneratedDrill });
export type PreviewResponse = z.infer<typeof PreviewResponse>;

/* ---------- saved drills and custom patterns ---------- */

const SavedName = z
  .string({ error: 'Name it' })
  .trim()
  .min(1, { error: 'Name it' })
  .max(80, { error: 'Keep the name under 80 characters' });

export const SavedDrill = z.object({
  id: z.string(),
  name: z.string(),
  spec: DrillSpec,
  keyOrder: KeyOrder.nullable(),
  owner: z.object({ id: z.string(), name: z.string(), role: z.string() }),
  mine: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type SavedDrill = z.infer<typeof SavedDrill>;

export const CreateSavedDrillInput = z.object({
  name: SavedName,
  spec: DrillSpec,
  keyOrder: KeyOrder.nullable().optional(),
});
export type CreateSavedDrillInput = z.infer<typeof CreateSavedDrillInput>;

export const UpdateSavedDrillInput = CreateSavedDrillInput.partial().refine((v) => Object.keys(v).length > 0, {
  error: 'Send at least one of name, spec, keyOrder',
});
export type UpdateSavedDrillInput = z.infer<typeof UpdateSavedDrillInput>;

export const SavedDrillResponse = z.object({ drill: SavedDrill });
export type SavedDrillResponse = z.infer<typeof SavedDrillResponse>;
export const SavedDrillsResponse = z.object({ drills: z.array(SavedDrill) });
export type SavedDrillsResponse = z.infer<typeof SavedDrillsResponse>;

export const CustomPattern = z.object({
  id: z.string(),
  name: z.string(),
  def: PatternDef,
  owner: z.object({ id: z.string(), name: z.string(), role: z.string() }),
  mine: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type CustomPattern = z.infer<typeof CustomPattern>;

export const CreateCustomPatternInput = z.object({ name: SavedName, def: PatternDef });
export type CreateCustomPatternInput = z.infer<typeof CreateCustomPatternInput>;
export const UpdateCustomPatternInput = CreateCustomPatternInput.partial().refine((v) => Object.keys(v).length > 0, {
  error: 'Send a name or a def',
});
export type UpdateCustomPatternInput = z.infer<typeof UpdateCustomPatternInput>;

export const CustomPatternResponse = z.object({ pattern: CustomPattern });
export type CustomPatternResponse = z.infer<typeof CustomPatternResponse>;
export const CustomPatternsResponse = z.object({ patterns: z.array(CustomPattern) });
export type CustomPatternsResponse = z.infer<typeof CustomPatternsResponse>;

export const IdParams = z.object({ id: z.string().max(64) });
