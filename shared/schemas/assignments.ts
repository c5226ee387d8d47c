import { z } from 'zod';
import { DrillSpec, KeyOrder } from './drills';
import { TimeZone, WeekFigures } from './maps';

export const AssignmentStatus = z.enum(['open', 'overdue', 'met']);
export type AssignmentStatus = z.infer<typeof AssignmentStatus>;

export const CreateAssignmentInput = z.object({
  savedDrillId: z.uuid({ error: 'Pick one of your saved drills' }),
  /** null or absent: the drill's own key only; an order: the key cycle through all 12 keys */
  keyOrder: KeyOrder.nullable().optional(),
  targetTempo: z
    .number({ error: 'Set a target tempo' })
    .int({ error: 'Use a whole number of bpm' })
    .min(20, { error: 'At least 20 bpm' })
    .max(400, { error: 'At most 400 bpm' }),
  /** 0..1 */
  targetAccuracy: z
    .number({ error: 'Set a target accuracy' })
    .min(0.05, { error: 'At least 5%' })
    .max(1, { error: 'At most 100%' }),
  // (the database's calendar has no year 0)
  dueAt: z.iso
    .datetime({ offset: true, error: 'Pick a due date' })
    .refine((d) => !d.startsWith('0000'), { error: 'Dates start in the year 1' }),
  note: z.string().trim().max(1000, { error: 'Keep the note under 1000 characters' }).optional().default(''),
  title: z.string().trim().min(1).max(120, { error: 'Keep the title under 120 characters' }).optional(),
});
export type CreateAssignmentInput = z.input<typeof CreateAssignmentInput>;

/** How far one player is with an assignment. */
export const PlayerProgress = z.object({
  playerId: z.string(),
  status: AssignmentStatus,
  /** keys with a whole take of the same drill at the targets (any button), made after the assignment was set */
  keysMet: z.array(z.string()),
});
export type PlayerProgress = z.infer<typeof PlayerProgress>;

export const Assignment = z.object({
  id: z.string(),
  studioId: z.string(),
  studioName: z.string(),
  savedDrillId: z.string().nullable(),
  title: z.string(),
  spec: DrillSpec,
  keyOrder: KeyOrder.nullable(),
  keys: z.array(z.string()),
  targetTempo: z.number(),
  targetAccuracy: z.number(),
  dueAt: z.string(),
  note: z.string(),
  createdAt: z.string(),
  /** the viewer's own status (a player), or null for the teacher */
  status: AssignmentStatus.nullable(),
  keysMet: z.array(z.string()),
  /** every player's progress: for the teacher and admins only */
  players: z.array(PlayerProgress).optional(),
});
export type Assignment = z.infer<typeof Assignment>;

export const AssignmentResponse = z.object({ assignment: Assignment });
export type AssignmentResponse = z.infer<typeof AssignmentResponse>;
export const AssignmentsResponse = z.object({ assignments: z.array(Assignment) });
export type AssignmentsResponse = z.infer<typeof AssignmentsResponse>;

export const AssignmentParams = z.object({ id: z.uuid({ error: 'That is not an assignment id' }) });

/** One row of the studio table: a player, their last practice, their accuracy by week. */
export const BoardRow = z.object({
  player: z.object({ id: z.string(), name: z.string(), email: z.string() }),
  lastPracticeAt: z.string().nullable(),
  /** mean accuracy (0..1) for each of the last six weeks, oldest first; null for a week without takes */
  trend: z.array(z.number().nullable()),
  takesThisWeek: z.number().int(),
  statuses: z.record(z.string(), AssignmentStatus),
});
export type BoardRow = z.infer<typeof BoardRow>;

export const BoardResponse = z.object({ assignments: z.array(Assignment), rows: z.array(BoardRow) });
export type BoardResponse = z.infer<typeof BoardResponse>;

/** A take in a teacher's list of one player's takes. */
export const TakeSummary = z.object({
  id: z.string(),
  assignmentId: z.string().nullable(),
  key: z.string(),
  pattern: z.string(),
  pair: z.string(),
  tempo: z.number(),
  accuracy: z.number(),
  startedAt: z.string(),
  remarkCount: z.number().int(),
});
export type TakeSummary = z.infer<typeof TakeSummary>;

export const StudioPlayerResponse = z.object({
  player: z.object({ id: z.string(), name: z.string(), email: z.string() }),
  takes: z.array(TakeSummary),
  assignments: z.array(Assignment),
});
export type StudioPlayerResponse = z.infer<typeof StudioPlayerResponse>;

/** Week over week for one assignment: each player's takes of its drill in its keys. */
export const AssignmentWeeklyResponse = z.object({
  weeks: z.array(z.string()),
  players: z.array(
    z.object({
      playerId: z.string(),
      name: z.string(),
      weeks: z.array(WeekFigures),
    }),
  ),
});
export type AssignmentWeeklyResponse = z.infer<typeof AssignmentWeeklyResponse>;

export const AssignmentWeeklyQuery = z.object({ tz: TimeZone.default('UTC') });

/** A typed day ("2026-03-01") as the end of that day in the browser's own time zone, or '' when it is no day. */
function endOfDay(day: string): string {
  const t = new Date(`${day}T23:59:00`);
  return Number.isNaN(t.getTime()) ? '' : t.toISOString();
}

/**
 * The assignment form in the browser: the accuracy typed in percent and the due date as a day
 * (due at its end), then held to `CreateAssignmentInput`'s own rules under the same names.
 */
export const AssignmentFormInput = CreateAssignmentInput.extend({
  targetAccuracy: z
    .number({ error: 'Set a target accuracy' })
    .transform((percent) => percent / 100)
    .pipe(CreateAssignmentInput.shape.targetAccuracy),
  dueAt: z
    .string({ error: 'Pick a due date' })
    .regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'Pick a due date' })
    .transform(endOfDay)
    .pipe(CreateAssignmentInput.shape.dueAt),
});
