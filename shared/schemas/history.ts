import { z } from 'zod';
import { ROOT_SPELLINGS } from '../engine/theory/spelling';
import { DrillSpec } from './drills';

/** The 12 keys in the order every table and map shows them. */
export const KEYS = ROOT_SPELLINGS;
export const KeyName = z.enum(KEYS as unknown as [string, ...string[]], {
  error: 'A key is one of C Db D Eb E F F# G Ab A Bb B',
});

// The database's dates start at year 1 (there is no year 0 in the calendar it uses).
const Day = z.iso
  .date({ error: 'Dates are written YYYY-MM-DD' })
  .refine((d) => d >= '0001-01-01', { error: 'Dates start at 0001-01-01' });
const Text = z.string().trim().min(1).max(80);

/** Filters shared by the history list and the maps; days are whole UTC days, both ends included. */
export const TakeFilters = z.object({
  key: KeyName.optional(),
  pattern: Text.optional(),
  instrument: Text.optional(),
  pair: Text.optional(),
  from: Day.optional(),
  to: Day.optional(),
  /** a teacher looking at one of their studio's players */
  player: z.uuid({ error: 'player must be a player id' }).optional(),
});
export type TakeFilters = z.infer<typeof TakeFilters>;

export const TAKE_SORTS = ['startedAt', 'accuracy', 'tempo', 'key'] as const;

export const ListTakesQuery = TakeFilters.extend({
  sort: z.enum(TAKE_SORTS, { error: 'sort is startedAt, accuracy, tempo or key' }).default('startedAt'),
  dir: z.enum(['asc', 'desc'], { error: 'dir is asc or desc' }).default('desc'),
  page: z.coerce.number().int().min(1, { error: 'page starts at 1' }).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, { error: 'pageSize is at most 100' }).default(25),
});
export type ListTakesQuery = z.infer<typeof ListTakesQuery>;

/** One row of the history table. */
export const TakeSummary = z.object({
  id: z.string(),
  playerId: z.string(),
  startedAt: z.string(),
  pair: z.string(),
  pattern: z.string(),
  key: z.string(),
  instrument: z.string(),
  tempo: z.number(),
  accuracy: z.number(),
  meanOffsetMs: z.number().nullable(),
  noteCount: z.number(),
  durationMs: z.number().nullable(),
  measures: z.tuple([z.number(), z.number()]).nullable(),
  stopped: z.boolean(),
});
export type TakeSummary = z.infer<typeof TakeSummary>;

export const ListTakesResponse = z.object({
  takes: z.array(TakeSummary),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export type ListTakesResponse = z.infer<typeof ListTakesResponse>;

/** Largest MIDI file the import takes. */
export const MAX_IMPORT_BYTES = 1024 * 1024;

/** The text fields of a multipart import, next to its `file`. */
export const ImportTakeFields = z.object({
  spec: z
    .string({ error: 'spec must be a drill spec as JSON' })
    .transform((raw, ctx) => {
      try {
        return JSON.parse(raw) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message: 'spec must be a drill spec as JSON' });
        return z.NEVER;
      }
    })
    .pipe(DrillSpec),
  offsetMs: z.coerce
    .number({ error: 'offsetMs is a number of milliseconds' })
    .finite()
    .min(-600_000)
    .max(600_000)
    .optional(),
  mode: z.enum(['timed', 'free']).optional(),
});
export type ImportTakeFields = z.infer<typeof ImportTakeFields>;

/**
 * The import form in the browser: the file, the drill it was played from and the downbeat,
 * checked as the server checks the multipart fields (`ImportTakeFields`) and the file's size.
 */
export const ImportTakeInput = z.object({
  file: z
    .custom<File>((v) => typeof File !== 'undefined' && v instanceof File, { error: 'Choose a MIDI file' })
    .refine((f) => f.size > 0, { error: 'That file is empty' })
    .refine((f) => f.size <= MAX_IMPORT_BYTES, { error: 'At most 1 MB; a MIDI take is far smaller' }),
  spec: DrillSpec,
  offsetMs: ImportTakeFields.shape.offsetMs,
});
export type ImportTakeInput = z.infer<typeof ImportTakeInput>;
