import { sql } from 'drizzle-orm';
import { index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { PatternDef } from '../../../shared/schemas/drills';
import { users } from './users';

/** A pattern a player or teacher defined from PatternDef's fields. */
export const customPatterns = pgTable(
  'custom_patterns',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    ownerId: uuid('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    def: jsonb('def').$type<PatternDef>().notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true })
      .notNull()
      .defaultNow()
      .$onUpdate(() => sql`now()`),
  },
  (t) => [index('custom_patterns_owner_idx').on(t.ownerId, t.updatedAt)],
);

export type CustomPatternRow = typeof customPatterns.$inferSelect;
