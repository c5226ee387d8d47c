import { desc, eq } from 'drizzle-orm';
import type { AdminPurchase } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { books, purchases, users } from '../../db/schema';

const columns = {
  purchase: purchases,
  book: { id: books.id, title: books.title },
  player: { id: users.id, name: users.name, email: users.email },
};

type Joined = { purchase: typeof purchases.$inferSelect; book: AdminPurchase['book']; player: AdminPurchase['player'] };

export function presentPurchase(r: Joined): AdminPurchase {
  const p = r.purchase;
  return {
    id: p.id,
    book: r.book,
    player: r.player,
    amountMinor: p.amountMinor,
    currency: p.currency,
    status: p.status,
    createdAt: p.createdAt.toISOString(),
    paidAt: p.paidAt?.toISOString() ?? null,
    refundedAt: p.refundedAt?.toISOString() ?? null,
  };
}

/** Purchases for admins, newest first; a checkout that was opened and never paid stays 'pending'. */
export async function listPurchases(db: Db, limit = 300): Promise<AdminPurchase[]> {
  const rows = await db
    .select(columns)
    .from(purchases)
    .innerJoin(books, eq(books.id, purchases.bookId))
    .innerJoin(users, eq(users.id, purchases.playerId))
    .orderBy(desc(purchases.createdAt))
    .limit(limit);
  return rows.map(presentPurchase);
}

export async function getPurchase(db: Db, id: string): Promise<AdminPurchase | null> {
  const [row] = await db
    .select(columns)
    .from(purchases)
    .innerJoin(books, eq(books.id, purchases.bookId))
    .innerJoin(users, eq(users.id, purchases.playerId))
    .where(eq(purchases.id, id));
  return row ? presentPurchase(row) : null;
}
