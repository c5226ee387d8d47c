import { index, integer, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { sql } from 'drizzle-orm';
import type { PurchaseStatus } from '../../../shared/schemas/books';
import { books } from './books';
import { users } from './users';

/**
 * One checkout of a book by a player: made 'pending' when the checkout session is created,
 * 'paid' only by the signed checkout.session.completed webhook, 'refunded' by an admin.
 * A player holds at most one paid purchase of a book.
 */
export const purchases = pgTable(
  'purchases',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    bookId: uuid('book_id')
      .notNull()
      .references(() => books.id, { onDelete: 'restrict' }),
    playerId: uuid('player_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    /** the payment service's checkout session id */
    sessionId: text('session_id').notNull(),
    paymentIntentId: text('payment_intent_id'),
    refundId: text('refund_id'),
    amountMinor: integer('amount_minor').notNull(),
    currency: text('currency').notNull(),
    status: text('status').$type<PurchaseStatus>().notNull().default('pending'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    paidAt: timestamp('paid_at', { withTimezone: true }),
    refundedAt: timestamp('refunded_at', { withTimezone: true }),
  },
  (t) => [
    uniqueIndex('purchases_session_key').on(t.sessionId),
    uniqueIndex('purchases_one_paid_key').on(t.bookId, t.playerId).where(sql`${t.status} = 'paid'`),
    index('purchases_book_paid_idx').on(t.bookId, t.paidAt),
    index('purchases_player_idx').on(t.playerId),
  ],
);

/** Webhook events already handled, by the service's event id: the same event twice acts once. */
export const paymentEvents = pgTable('payment_events', {
  id: text('id').primaryKey(),
  type: text('type').notNull(),
  sessionId: text('session_id'),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});

export type PurchaseRow = typeof purchases.$inferSelect;
