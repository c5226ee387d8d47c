import { date, index, integer, pgTable, primaryKey, real, smallint, text, uuid } from 'drizzle-orm/pg-core';
import { users } from './users';

/*
 * What the key, range and beat maps add up: take_notes counted per player, UTC day and filter
 * (instrument, pattern, pair). Statement-level triggers on take_notes (migration
 * "maps-summary-triggers") add a take's notes in the transaction that stores it and take them
 * away when it is deleted, so a map reads a few thousand rows instead of every note ever played.
 * `errors` counts the notes whose verdict is not hit.
 */

const counts = {
  notes: integer('notes').notNull(),
  errors: integer('errors').notNull(),
};

const scope = {
  playerId: uuid('player_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  day: date('day').notNull(),
  instrument: text('instrument').notNull(),
  pattern: text('pattern').notNull(),
  pair: text('pair').notNull(),
};

export const mapKeyDays = pgTable('map_key_days', { ...scope, key: text('key').notNull(), ...counts }, (t) => [
  primaryKey({ columns: [t.playerId, t.day, t.instrument, t.pattern, t.pair, t.key] }),
  index('map_key_days_player_key_idx').on(t.playerId, t.key, t.pattern),
]);

export const mapRangeDays = pgTable(
  'map_range_days',
  { ...scope, midi: smallint('midi').notNull(), ...counts },
  (t) => [primaryKey({ columns: [t.playerId, t.day, t.instrument, t.pattern, t.pair, t.midi] })],
);

export const mapBeatDays = pgTable(
  'map_beat_days',
  { ...scope, meter: text('meter').notNull(), position: real('position').notNull(), ...counts },
  (t) => [primaryKey({ columns: [t.playerId, t.day, t.instrument, t.pattern, t.pair, t.meter, t.position] })],
);

/**
 * The range map over all time, without days: a pitch x pair grid stays a few thousand rows
 * however long the history, where the daily table grows by one row per pitch per day and pair.
 * Kept by the same triggers.
 */
export const mapRangeTotals = pgTable(
  'map_range_totals',
  {
    playerId: scope.playerId,
    instrument: text('instrument').notNull(),
    pattern: text('pattern').notNull(),
    pair: text('pair').notNull(),
    midi: smallint('midi').notNull(),
    ...counts,
  },
  (t) => [primaryKey({ columns: [t.playerId, t.instrument, t.pattern, t.pair, t.midi] })],
);
