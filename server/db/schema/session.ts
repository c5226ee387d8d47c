import { index, json, pgTable, timestamp, varchar } from 'drizzle-orm/pg-core';

/** connect-pg-simple's table, created by a migration rather than by the library. */
export const session = pgTable(
  'session',
  {
    sid: varchar('sid').primaryKey(),
    sess: json('sess').notNull(),
    expire: timestamp('expire', { precision: 6 }).notNull(),
  },
  (t) => [index('IDX_session_expire').on(t.expire)],
);
