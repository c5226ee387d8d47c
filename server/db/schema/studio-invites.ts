import { index, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { studios } from './studios';
import { users } from './users';

/**
 * An e-mailed invitation to join a studio. Only the SHA-256 of the link's token is kept; the
 * link works once (usedAt) and for seven days (expiresAt).
 */
export const studioInvites = pgTable(
  'studio_invites',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studioId: uuid('studio_id')
      .notNull()
      .references(() => studios.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    tokenHash: text('token_hash').notNull(),
    invitedBy: uuid('invited_by')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
    usedBy: uuid('used_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('studio_invites_token_hash_key').on(t.tokenHash),
    index('studio_invites_studio_idx').on(t.studioId, t.createdAt),
  ],
);

export type StudioInviteRow = typeof studioInvites.$inferSelect;
