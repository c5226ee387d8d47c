import { bigserial, index, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Failed sign-ins, kept in the database (not in memory) so that several server instances
 * count them together. Rows older than the window are pruned as new ones arrive.
 */
export const signInFailures = pgTable(
  'sign_in_failures',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    email: text('email').notNull(),
    ip: text('ip').notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('sign_in_failures_email_at_idx').on(t.email, t.at), index('sign_in_failures_ip_at_idx').on(t.ip, t.at)],
);
