import { type AnyPgColumn, index, integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { studios } from './studios';
import { takes } from './takes';
import { users } from './users';

/**
 * A teacher's comment on a take, optionally pinned to one expected note (noteIndex), or the
 * player's answer to one (parentId). Each belongs to the studio it was made in, so a teacher
 * sees only the remarks of their own studios.
 */
export const remarks = pgTable(
  'remarks',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    takeId: uuid('take_id')
      .notNull()
      .references(() => takes.id, { onDelete: 'cascade' }),
    studioId: uuid('studio_id')
      .notNull()
      .references(() => studios.id, { onDelete: 'cascade' }),
    authorId: uuid('author_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    parentId: uuid('parent_id').references((): AnyPgColumn => remarks.id, { onDelete: 'cascade' }),
    noteIndex: integer('note_index'),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('remarks_take_idx').on(t.takeId, t.createdAt), index('remarks_studio_idx').on(t.studioId)],
);

export type RemarkRow = typeof remarks.$inferSelect;
