import { index, integer, jsonb, pgTable, real, smallint, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { DrillSpec, PlayedNote, ScoreOptions, TakeScore } from '../../../shared/engine/types';
import type { InputKind } from '../../../shared/schemas/takes';
import { users } from './users';

/**
 * One attempt at a drill: the raw notes as played, the options they were scored with, and the
 * server's own score. The id is made by the browser, so a retried upload is the same take.
 */
export const takes = pgTable(
  'takes',
  {
    id: uuid('id').primaryKey(),
    playerId: uuid('player_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    assignmentId: uuid('assignment_id'),
    spec: jsonb('spec').$type<DrillSpec>().notNull(),
    options: jsonb('options').$type<ScoreOptions>().notNull(),
    measureFrom: smallint('measure_from'),
    measureTo: smallint('measure_to'),
    stoppedAtMs: real('stopped_at_ms'),
    /** what the take was played on (null: takes from before it was recorded) */
    inputKind: text('input_kind').$type<InputKind>(),
    played: jsonb('played').$type<PlayedNote[]>().notNull(),
    score: jsonb('score').$type<TakeScore>().notNull(),
    // Denormalised from spec and score for the history table and the maps.
    key: text('key').notNull(),
    pattern: text('pattern').notNull(),
    pair: text('pair').notNull(),
    instrument: text('instrument').notNull(),
    tempo: real('tempo').notNull(),
    accuracy: real('accuracy').notNull(),
    meanOffsetMs: real('mean_offset_ms'),
    noteCount: integer('note_count').notNull(),
    /** how long the take ran (the later of the drill's end and the last note played): practice minutes */
    durationMs: real('duration_ms'),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('takes_player_started_idx').on(t.playerId, t.startedAt),
    index('takes_assignment_idx').on(t.assignmentId),
  ],
);

/**
 * One row per expected note that was scored, with its verdict: what the key, range and beat maps
 * add up in SQL. Notes after a take's stop point, and outside a ladder step, never get a row.
 */
export const takeNotes = pgTable(
  'take_notes',
  {
    // No foreign key: its check ran once per note (500 a take). Notes are only ever written in the
    // statement that writes their take, and a statement trigger on takes (migration
    // "take-notes-follow-takes") deletes a deleted take's notes, as the cascade did.
    takeId: uuid('take_id').notNull(),
    idx: integer('idx').notNull(),
    playerId: uuid('player_id').notNull(),
    midi: smallint('midi').notNull(),
    beat: real('beat').notNull(),
    measure: smallint('measure').notNull(),
    /** beatInMeasure rounded to 1/12 of a beat */
    position: real('position').notNull(),
    meter: text('meter').notNull(),
    verdict: text('verdict').$type<'hit' | 'early' | 'late' | 'wrong' | 'missed'>().notNull(),
    offsetMs: real('offset_ms'),
    key: text('key').notNull(),
    pattern: text('pattern').notNull(),
    pair: text('pair').notNull(),
    instrument: text('instrument').notNull(),
    playedAt: timestamp('played_at', { withTimezone: true }).notNull(),
  },
  // Only a take's own notes are ever read back (by take and index); the maps read the summaries,
  // so there is no index by player and time to keep up on every insert.
  (t) => [index('take_notes_take_idx').on(t.takeId, t.idx)],
);

export type TakeRow = typeof takes.$inferSelect;
