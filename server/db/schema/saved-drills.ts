import { sql } from 'drizzle-orm';
import { index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { DrillSpec, KeyOrder } from '../../../shared/schemas/drills';
import { users } from './users';

/** A named drill a player or teacher keeps: the spec, and the key-cycle order it is drilled in. */
export const savedDrills = pgTable(
  'saved_drills',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    ownerId: uuid('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    spec: jsonb('spec').$type<DrillSpec>().notNull(),
    keyOrder: text('key_order').$type<KeyOrder>(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true })
      .notNull()
      .defaultNow()
      .$onUpdate(() => sql`now()`),
  },
  (t) => [index('saved_drills_owner_idx').on(t.ownerId, t.updatedAt)],
);

export type SavedDrillRow = typeof savedDrills.$inferSelect;
