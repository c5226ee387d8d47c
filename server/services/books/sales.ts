import { and, asc, eq, gte, inArray, sql } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { SalesResponse } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { books, purchases } from '../../db/schema';

/**
 * A teacher's sales per book (paid and kept, refunded, revenue of the kept ones) and per day
 * over the last 90 days (UTC days of payment), all counted in SQL.
 */
export async function bookSales(db: Db, teacher: User): Promise<SalesResponse> {
  const rows = await db
    .select({
      id: books.id,
      title: books.title,
      currency: books.currency,
      priceMinor: books.priceMinor,
      published: books.published,
      sales: sql<number>`count(${purchases.id}) filter (where ${purchases.status} = 'paid')::int`,
      refunds: sql<number>`count(${purchases.id}) filter (where ${purchases.status} = 'refunded')::int`,
      revenueMinor: sql<number>`coalesce(sum(${purchases.amountMinor}) filter (where ${purchases.status} = 'paid'), 0)::int`,
    })
    .from(books)
    .leftJoin(purchases, eq(purchases.bookId, books.id))
    .where(eq(books.teacherId, teacher.id))
    .groupBy(books.id)
    .orderBy(asc(books.title));
  const ids = rows.map((r) => r.id);
  const since = new Date(Date.now() - 90 * 86_400_000);
  const day = sql<string>`to_char(${purchases.paidAt} at time zone 'UTC', 'YYYY-MM-DD')`;
  const days =
    ids.length === 0
      ? []
      : await db
          .select({
            day,
            bookId: purchases.bookId,
            sales: sql<number>`count(*)::int`,
            revenueMinor: sql<number>`coalesce(sum(${purchases.amountMinor}), 0)::int`,
          })
          .from(purchases)
          .where(and(inArray(purchases.bookId, ids), eq(purchases.status, 'paid'), gte(purchases.paidAt, since)))
          .groupBy(day, purchases.bookId)
          .orderBy(day);
  return { books: rows, days };
}
