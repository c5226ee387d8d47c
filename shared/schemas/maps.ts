import { z } from 'zod';
import { DrillSpec } from './drills';
import { TakeFilters } from './history';

/** Map filters: the history filters without the key (a map is over keys). */
export const MapQuery = TakeFilters.omit({ key: true });
export type MapQuery = z.infer<typeof MapQuery>;

const Counts = { notes: z.number(), errors: z.number(), rate: z.number() };

export const KeyCell = z.object({ key: z.string(), pattern: z.string(), ...Counts });
export type KeyCell = z.infer<typeof KeyCell>;
export const RangeCell = z.object({ midi: z.number(), ...Counts });
export type RangeCell = z.infer<typeof RangeCell>;
export const BeatCell = z.object({ meter: z.string(), position: z.number(), ...Counts });
export type BeatCell = z.infer<typeof BeatCell>;

export const KeyMapResponse = z.object({ cells: z.array(KeyCell) });
export type KeyMapResponse = z.infer<typeof KeyMapResponse>;
export const RangeMapResponse = z.object({ cells: z.array(RangeCell) });
export type RangeMapResponse = z.infer<typeof RangeMapResponse>;
export const BeatMapResponse = z.object({ cells: z.array(BeatCell) });
export type BeatMapResponse = z.infer<typeof BeatMapResponse>;

export const TimeZone = z
  .string()
  .max(64)
  .refine(
    (tz) => {
      try {
        new Intl.DateTimeFormat('en', { timeZone: tz });
        return true;
      } catch {
        return false;
      }
    },
    { error: 'tz must be a time zone name such as Europe/Lisbon' },
  );

/** Charts count days in the player's own time zone. */
export const ChartQuery = TakeFilters.extend({ tz: TimeZone.default('UTC') });
export type ChartQuery = z.infer<typeof ChartQuery>;

export const TimelinePoint = z.object({
  day: z.string(),
  key: z.string(),
  takes: z.number(),
  accuracy: z.number(),
  tempo: z.number(),
});
export type TimelinePoint = z.infer<typeof TimelinePoint>;
export const TimelineResponse = z.object({ points: z.array(TimelinePoint) });
export type TimelineResponse = z.infer<typeof TimelineResponse>;

export const PracticeDay = z.object({ day: z.string(), minutes: z.number(), takes: z.number() });
export type PracticeDay = z.infer<typeof PracticeDay>;
export const CalendarResponse = z.object({
  days: z.array(PracticeDay),
  /** consecutive practice days ending today or yesterday, and the longest run */
  streak: z.object({ current: z.number(), longest: z.number() }),
  today: z.string(),
  /** the player's own weekly minutes goal; null when they set none */
  weeklyMinutesGoal: z.number().nullable(),
});
export type CalendarResponse = z.infer<typeof CalendarResponse>;

export const NextQuery = z.object({ player: z.uuid().optional(), tz: TimeZone.default('UTC') });

export const NextItem = z.object({
  key: z.string(),
  pattern: z.string(),
  reason: z.enum(['weak', 'unpractised']),
  notes: z.number(),
  errors: z.number(),
  rate: z.number().nullable(),
  daysSince: z.number().nullable(),
  /** rate x (1 + days since last practised / 30), the order of the weak cells */
  score: z.number().nullable(),
  /** the drill to practise: the player's latest pair for that pattern, moved to the key */
  spec: DrillSpec.nullable(),
});
export type NextItem = z.infer<typeof NextItem>;
export const NextResponse = z.object({ items: z.array(NextItem) });
export type NextResponse = z.infer<typeof NextResponse>;

/** One week of one drill (or one player's assignment): mean accuracy and the fastest tempo. */
export const WeekFigures = z.object({
  /** the Monday the week starts on, in the player's time zone */
  week: z.string(),
  takes: z.number(),
  /** 0..1; null for a week without takes */
  accuracy: z.number().nullable(),
  tempo: z.number().nullable(),
});
export type WeekFigures = z.infer<typeof WeekFigures>;

export const WeeklyDrill = z.object({
  pattern: z.string(),
  pair: z.string(),
  instrument: z.string(),
  /** oldest first, one entry per week shown */
  weeks: z.array(WeekFigures),
});
export type WeeklyDrill = z.infer<typeof WeeklyDrill>;

/** Week over week, per drill (pattern and pair): the drills practised in the weeks shown. */
export const WeeklyResponse = z.object({ weeks: z.array(z.string()), drills: z.array(WeeklyDrill) });
export type WeeklyResponse = z.infer<typeof WeeklyResponse>;
