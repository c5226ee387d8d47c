import { sql } from 'drizzle-orm';
import { boolean, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { CoverColour, Currency } from '../../../shared/schemas/books';
import type { DrillSpec, KeyOrder } from '../../../shared/schemas/drills';
import { savedDrills } from './saved-drills';
import { users } from './users';

/** A teacher's drill book: published free (price 0) or at a price in minor units of a currency. */
export const books = pgTable(
  'books',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teacherId: uuid('teacher_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    title: text('title').notNull(),
    description: text('description').notNull().default(''),
    coverColour: text('cover_colour').$type<CoverColour>().notNull().default('brass'),
    priceMinor: integer('price_minor').notNull().default(0),
    currency: text('currency').$type<Currency>().notNull().default('EUR'),
    published: boolean('published').notNull().default(false),
    publishedAt: timestamp('published_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true })
      .notNull()
      .defaultNow()
      .$onUpdate(() => sql`now()`),
  },
  (t) => [index('books_teacher_idx').on(t.teacherId), index('books_published_idx').on(t.published, t.publishedAt)],
);

/**
 * One drill of a book, in order. The spec is copied from the saved drill when it is added, so
 * a published book never changes under its buyers when the teacher edits the saved drill.
 * At most one drill per book is free to try (a partial unique index).
 */
export const bookDrills = pgTable(
  'book_drills',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    bookId: uuid('book_id')
      .notNull()
      .references(() => books.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    savedDrillId: uuid('saved_drill_id').references(() => savedDrills.id, { onDelete: 'set null' }),
    title: text('title').notNull(),
    note: text('note').notNull().default(''),
    spec: jsonb('spec').$type<DrillSpec>().notNull(),
    /** null: the drill's own key; otherwise a key cycle in this order */
    keyCycle: text('key_cycle').$type<KeyOrder>(),
    free: boolean('free').notNull().default(false),
  },
  (t) => [
    index('book_drills_book_idx').on(t.bookId, t.position),
    uniqueIndex('book_drills_one_free_key').on(t.bookId).where(sql`${t.free}`),
  ],
);

export type BookRow = typeof books.$inferSelect;
export type BookDrillRow = typeof bookDrills.$inferSelect;
