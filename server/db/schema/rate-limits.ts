import { index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Fixed-window request counters (password reset, sign-up, invites), kept in the database so
 * every server instance counts together. One row per key; a new window starts the count again.
 */
export const rateLimits = pgTable(
  'rate_limits',
  {
    key: text('key').primaryKey(),
    windowStart: timestamp('window_start', { withTimezone: true }).notNull(),
    hits: integer('hits').notNull(),
  },
  (t) => [index('rate_limits_window_start_idx').on(t.windowStart)],
);
