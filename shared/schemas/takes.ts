import { z } from 'zod';
import { MAX_FILE_NOTES } from '../engine';
import { DrillSpec, DrillSpecInput } from './drills';

/**
 * The most notes one take may hold: far beyond any drill, small enough to score at once. The
 * engine's own limit for a MIDI file, which it counts before reading one, so the two agree.
 */
export const MAX_PLAYED_NOTES = MAX_FILE_NOTES;

export const PlayedNoteInput = z.object({
  midi: z.number({ error: 'midi must be a note number' }).int().min(0).max(127),
  timeMs: z.number({ error: 'timeMs must be a number of milliseconds' }).finite(),
  velocity: z.number().int().min(0).max(127).optional(),
  durationMs: z.number().finite().min(0).optional(),
});

export const ScoreOptionsInput = z.object({
  tempo: z.number().finite().min(20).max(400),
  mode: z.enum(['timed', 'free'], { error: 'mode is timed or free' }),
  octaveTolerant: z.boolean().optional(),
  hitWindowMs: z.number().finite().positive().optional(),
  matchWindowMs: z.number().finite().positive().optional(),
  swing: z
    .number()
    .min(0.5, { error: 'swing runs from 0.5 (straight) to 0.75' })
    .max(0.75, { error: 'swing runs from 0.5 (straight) to 0.75' })
    .optional(),
  inputTransposition: z.number().int().min(-48).max(48).optional(),
});

/**
 * What a take was played on: a MIDI device, the on-screen or computer keyboard, an acoustic
 * instrument through the microphone, or a MIDI file imported afterwards.
 */
export const InputKind = z.enum(['midi', 'keyboard', 'microphone', 'file'], {
  error: 'inputKind is midi, keyboard, microphone or file',
});
export type InputKind = z.infer<typeof InputKind>;

export const CreateTakeInput = z
  .object({
    id: z.uuid({ error: 'id must be a UUID made by the client' }),
    spec: DrillSpecInput,
    played: z
      .array(PlayedNoteInput, { error: 'played must be a list of notes' })
      .max(MAX_PLAYED_NOTES, { error: `A take holds at most ${MAX_PLAYED_NOTES.toLocaleString('en')} notes` }),
    options: ScoreOptionsInput,
    startedAt: z.iso
      .datetime({ offset: true, error: 'startedAt must be an ISO date-time' })
      .refine((d) => !d.startsWith('0000'), { error: 'Dates start in the year 1' }),
    measures: z
      .tuple([z.number().int().min(1), z.number().int().min(1)])
      .refine(([a, b]) => a <= b, { error: 'measures must run from a lower to a higher measure' })
      .optional()
      .nullable(),
    stoppedAtMs: z.number().finite().min(0).optional().nullable(),
    assignmentId: z.uuid().optional().nullable(),
    inputKind: InputKind.optional().nullable(),
  })
  .strict();
export type CreateTakeInput = z.infer<typeof CreateTakeInput>;

export const TakeIdParams = z.object({ id: z.uuid({ error: 'That is not a take id' }) });

const Verdict = z.enum(['hit', 'early', 'late', 'wrong', 'missed']);

/** One expected note's result, as the scorer gives it. */
export const NoteResult = z.object({
  verdict: Verdict,
  playedIndex: z.number().int().nullable(),
  offsetMs: z.number().nullable(),
});

/** A take's score: one result per expected note, the unmatched played notes, and the figures. */
export const TakeScoreSchema = z.object({
  results: z.array(NoteResult),
  extras: z.array(z.number().int()),
  accuracy: z.number().min(0).max(1),
  meanOffsetMs: z.number().nullable(),
  spreadMs: z.number().nullable(),
});

/**
 * A stored take as the API answers it: the same shape for POST /api/takes, GET /api/takes/:id,
 * the player's take page and the teacher's review. The server's presenter builds it; the
 * browser reads it with this type; the API tests parse answers with it.
 */
export const Take = z.object({
  id: z.uuid(),
  playerId: z.uuid(),
  assignmentId: z.uuid().nullable(),
  spec: DrillSpec,
  options: ScoreOptionsInput,
  measures: z.tuple([z.number().int(), z.number().int()]).nullable(),
  stoppedAtMs: z.number().nullable(),
  /** what it was played on; null for takes stored before this was recorded */
  inputKind: InputKind.nullable(),
  played: z.array(PlayedNoteInput),
  score: TakeScoreSchema,
  key: z.string(),
  pattern: z.string(),
  pair: z.string(),
  instrument: z.string(),
  tempo: z.number(),
  accuracy: z.number(),
  meanOffsetMs: z.number().nullable(),
  startedAt: z.iso.datetime({ offset: true }),
  createdAt: z.iso.datetime({ offset: true }),
});
export type Take = z.infer<typeof Take>;

export const TakeResponse = z.object({ take: Take });
export type TakeResponse = z.infer<typeof TakeResponse>;
