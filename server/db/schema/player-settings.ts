import { boolean, jsonb, pgTable, real, smallint, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './users';

/** What a player set once and expects every drill and take to remember. */
export const playerSettings = pgTable('player_settings', {
  userId: uuid('user_id')
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  instrument: text('instrument').notNull().default('piano'),
  /** "my keyboard plays written pitch" (a transposing instrument's player on a keyboard) */
  writtenPitchInput: boolean('written_pitch_input').notNull().default(false),
  /** octaves added to every played note (a short keyboard) */
  octaveShift: smallint('octave_shift').notNull().default(0),
  rangeLow: smallint('range_low'),
  rangeHigh: smallint('range_high'),
  defaultTempo: real('default_tempo').notNull().default(100),
  /** input device name -> its measured latency in ms, taken off its note times */
  /** the minutes a week the player means to practise, drawn against their practice log; null: none set */
  weeklyMinutesGoal: smallint('weekly_minutes_goal'),
  latency: jsonb('latency').$type<Record<string, number>>().notNull().default({}),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

export type PlayerSettingsRow = typeof playerSettings.$inferSelect;
