import { pgTable, primaryKey, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './users';

/**
 * The tempo a player has climbed to, per drill (its shape, whatever the key) and key: raised
 * after a clean take, lowered after a messy one, suggested for the next take.
 */
export const tempoClimbs = pgTable(
  'tempo_climbs',
  {
    playerId: uuid('player_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    drill: text('drill').notNull(),
    key: text('key').notNull(),
    tempo: real('tempo').notNull(),
    lastTempo: real('last_tempo').notNull(),
    lastVerdict: text('last_verdict').$type<'up' | 'down' | 'hold'>().notNull(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.playerId, t.drill, t.key] })],
);
