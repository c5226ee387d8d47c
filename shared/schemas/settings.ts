import { z } from 'zod';
import { InstrumentIdSchema } from './drills';

const Midi = z.number().int().min(0).max(127);

export const PlayerSettings = z.object({
  instrument: InstrumentIdSchema,
  writtenPitchInput: z.boolean(),
  octaveShift: z
    .number()
    .int()
    .min(-3, { error: 'Shift at most 3 octaves' })
    .max(3, { error: 'Shift at most 3 octaves' }),
  range: z
    .object({ low: Midi, high: Midi })
    .refine((r) => r.low < r.high, { error: 'The lowest note must be below the highest' })
    .nullable(),
  defaultTempo: z
    .number({ error: 'Tempo runs from 20 to 400' })
    .min(20, { error: 'Tempo runs from 20 to 400' })
    .max(400, { error: 'Tempo runs from 20 to 400' }),
  latency: z.record(z.string().max(200), z.number().min(-500).max(500)),
  /** minutes a week the player means to practise; null: no goal set */
  weeklyMinutesGoal: z
    .number({ error: 'The weekly goal is a number of minutes' })
    .int({ error: 'Use whole minutes' })
    .min(10, { error: 'Set a weekly goal from 10 to 2000 minutes' })
    .max(2000, { error: 'Set a weekly goal from 10 to 2000 minutes' })
    .nullable()
    .optional(),
});
export type PlayerSettings = z.infer<typeof PlayerSettings>;

export const UpdateSettingsInput = PlayerSettings.omit({ latency: true }).partial().strict();
export type UpdateSettingsInput = z.infer<typeof UpdateSettingsInput>;

export const SetLatencyInput = z.object({
  device: z.string({ error: 'Name the input device' }).min(1).max(200),
  offsetMs: z
    .number({ error: 'offsetMs must be a number' })
    .min(-500, { error: 'A latency beyond half a second is not a latency; tap again' })
    .max(500, {
      error: 'A latency beyond half a second is not a latency; tap again',
    }),
});
export type SetLatencyInput = z.infer<typeof SetLatencyInput>;

export const SettingsResponse = z.object({ settings: PlayerSettings });
export type SettingsResponse = z.infer<typeof SettingsResponse>;

export const SuggestTempoQuery = z.object({ spec: z.string().min(2).max(8000) });
export const SuggestTempoResponse = z.object({
  climb: z
    .object({
      tempo: z.number(),
      lastTempo: z.number(),
      lastVerdict: z.enum(['up', 'down', 'hold']),
      updatedAt: z.string(),
    })
    .nullable(),
});
export type SuggestTempoResponse = z.infer<typeof SuggestTempoResponse>;
