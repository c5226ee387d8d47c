import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import { type AdminPurchase, formatPrice } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { auditLog, books, purchases } from '../../db/schema';
import type { Env } from '../../env';
import { AppError, notFound } from '../../errors';
import { paymentsClient } from '../../payments/client';
import { getPurchase } from './list';

/**
 * An admin refunds a paid purchase: the payment service refunds it first, then the purchase is
 * marked refunded (which takes the book away) and the audit log says who did it, together.
 */
export async function refundPurchase(db: Db, env: Env, admin: User, id: string): Promise<AdminPurchase> {
  const [purchase] = await db.select().from(purchases).where(eq(purchases.id, id));
  if (!purchase) throw notFound('That purchase');
  if (purchase.status !== 'paid' || !purchase.paymentIntentId)
    throw new AppError('conflict', 'Only a paid purchase can be refunded');
  let refundId: string;
  try {
    const refund = await paymentsClient(env).refunds.create({ payment_intent: purchase.paymentIntentId });
    refundId = refund.id;
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    console.error('[payments] refund failed:', message);
    throw new AppError('unavailable', `The payment service did not refund it: ${message}`);
  }
  await db.transaction(async (tx) => {
    const [book] = await tx.select({ title: books.title }).from(books).where(eq(books.id, purchase.bookId));
    const done = await tx
      .update(purchases)
      .set({ status: 'refunded', refundId, refundedAt: new Date() })
      .where(and(eq(purchases.id, id), eq(purchases.status, 'paid')))
      .returning({ id: purchases.id });
    if (done.length === 0) throw new AppError('conflict', 'That purchase was refunded already');
    await tx.insert(auditLog).values({
      actorId: admin.id,
      targetId: purchase.playerId,
      action: 'purchase.refund',
      detail: {
        purchaseId: id,
        bookId: purchase.bookId,
        book: book?.title ?? '',
        amount: formatPrice(purchase.amountMinor, purchase.currency),
        refundId,
      },
    });
  });
  return (await getPurchase(db, id))!;
}
