import { bigserial, index, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * What the local fake SMTP server received (development and test only): one row per
 * recipient, in the database so every server instance and test sees the same outbox.
 */
export const devOutbox = pgTable(
  'dev_outbox',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    to: text('to').notNull(),
    from: text('from').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html').notNull(),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('dev_outbox_to_idx').on(t.to)],
);
