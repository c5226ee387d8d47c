import { index, jsonb, pgTable, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { DrillSpec, KeyOrder } from '../../../shared/schemas/drills';
import { savedDrills } from './saved-drills';
import { studios } from './studios';
import { users } from './users';

/**
 * A drill (one key) or key cycle (all twelve) a teacher sets for a studio's players. The spec
 * and the keys are copied when it is set, so editing the saved drill later changes nothing;
 * `keys` lists every key that needs a take at the targets for the assignment to be met.
 */
export const assignments = pgTable(
  'assignments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studioId: uuid('studio_id')
      .notNull()
      .references(() => studios.id, { onDelete: 'cascade' }),
    setBy: uuid('set_by')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    savedDrillId: uuid('saved_drill_id').references(() => savedDrills.id, { onDelete: 'set null' }),
    title: text('title').notNull(),
    spec: jsonb('spec').$type<DrillSpec>().notNull(),
    /** null: the drill's own key only; otherwise the key cycle's order */
    keyOrder: text('key_order').$type<KeyOrder>(),
    keys: text('keys').array().notNull(),
    targetTempo: real('target_tempo').notNull(),
    /** 0..1 */
    targetAccuracy: real('target_accuracy').notNull(),
    dueAt: timestamp('due_at', { withTimezone: true }).notNull(),
    note: text('note').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('assignments_studio_idx').on(t.studioId, t.dueAt)],
);

export type AssignmentRow = typeof assignments.$inferSelect;
