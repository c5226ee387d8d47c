import { pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { studios } from './studios';

/** One row per studio and week whose summary went out, so no instance sends it twice. */
export const weeklySummaries = pgTable(
  'weekly_summaries',
  {
    studioId: uuid('studio_id')
      .notNull()
      .references(() => studios.id, { onDelete: 'cascade' }),
    /** the Monday (UTC) the week starts on, YYYY-MM-DD */
    week: text('week').notNull(),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.studioId, t.week] })],
);
