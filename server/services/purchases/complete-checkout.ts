import { and, eq, ne } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Db } from '../../db/client';
import { books, paymentEvents, purchases, users } from '../../db/schema';
import type { Mailer } from '../../mail/mailer';
import { bookReceiptMail } from '../../mail/templates/book-receipt';

interface Grant {
  purchaseId: string;
  bookId: string;
  bookTitle: string;
  teacherName: string;
  playerEmail: string;
  playerName: string;
  amountMinor: number;
  currency: string;
  paidAt: Date;
}

/**
 * Handles one verified webhook event. Each event id is recorded once (a second delivery of the
 * same event does nothing); a `checkout.session.completed` that is paid, for the amount and
 * currency the checkout was opened with, marks the purchase paid: that is what grants the
 * book. The receipt is e-mailed after the grant is committed.
 * Returns whether this delivery granted access.
 */
export async function completeCheckout(
  db: Db,
  mailer: Mailer,
  origin: string | null,
  event: Stripe.Event,
): Promise<boolean> {
  const grant = await db.transaction(async (tx): Promise<Grant | null> => {
    const session = event.type === 'checkout.session.completed' ? event.data.object : null;
    const [fresh] = await tx
      .insert(paymentEvents)
      .values({ id: event.id, type: event.type, sessionId: session?.id ?? null })
      .onConflictDoNothing()
      .returning({ id: paymentEvents.id });
    if (!fresh || !session || session.payment_status !== 'paid') return null;

    let [purchase] = await tx.select().from(purchases).where(eq(purchases.sessionId, session.id)).for('update');
    if (!purchase) {
      // A session opened by another instance that lost its row: rebuild it from the metadata.
      const bookId = session.metadata?.bookId;
      const playerId = session.metadata?.playerId;
      if (!bookId || !playerId) return null;
      const [book] = await tx.select().from(books).where(eq(books.id, bookId));
      const [player] = await tx.select({ id: users.id }).from(users).where(eq(users.id, playerId));
      if (!book || !player) return null;
      [purchase] = await tx
        .insert(purchases)
        .values({ bookId, playerId, sessionId: session.id, amountMinor: book.priceMinor, currency: book.currency })
        .returning();
    }
    if (purchase.status !== 'pending') return null;
    if (session.amount_total !== purchase.amountMinor || (session.currency ?? '').toUpperCase() !== purchase.currency) {
      console.warn(
        `[payments] session ${session.id} paid ${session.amount_total} ${session.currency}, expected ${purchase.amountMinor} ${purchase.currency}: not granted`,
      );
      return null;
    }
    const [already] = await tx
      .select({ id: purchases.id })
      .from(purchases)
      .where(
        and(
          eq(purchases.bookId, purchase.bookId),
          eq(purchases.playerId, purchase.playerId),
          eq(purchases.status, 'paid'),
          ne(purchases.id, purchase.id),
        ),
      );
    if (already) {
      console.warn(
        `[payments] session ${session.id} paid for a book the player already has (purchase ${already.id}); refund it from the admin page`,
      );
      return null;
    }
    const paymentIntent =
      typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
    const paidAt = new Date();
    await tx
      .update(purchases)
      .set({ status: 'paid', paymentIntentId: paymentIntent, paidAt })
      .where(eq(purchases.id, purchase.id));
    const [info] = await tx
      .select({ title: books.title, teacherId: books.teacherId, email: users.email, name: users.name })
      .from(books)
      .innerJoin(users, eq(users.id, purchase.playerId))
      .where(eq(books.id, purchase.bookId));
    const [teacher] = await tx.select({ name: users.name }).from(users).where(eq(users.id, info.teacherId));
    return {
      purchaseId: purchase.id,
      bookId: purchase.bookId,
      bookTitle: info.title,
      teacherName: teacher?.name ?? 'your teacher',
      playerEmail: info.email,
      playerName: info.name,
      amountMinor: purchase.amountMinor,
      currency: purchase.currency,
      paidAt,
    };
  });
  if (!grant) return false;
  try {
    await mailer.send(
      bookReceiptMail({
        to: grant.playerEmail,
        player: grant.playerName,
        book: grant.bookTitle,
        teacher: grant.teacherName,
        amountMinor: grant.amountMinor,
        currency: grant.currency,
        purchaseId: grant.purchaseId,
        paidAt: grant.paidAt,
        link: `${origin ?? ''}/books/${grant.bookId}`,
      }),
    );
  } catch (err) {
    // The purchase stands; a lost receipt must not make the service resend the payment.
    console.error('[payments] receipt e-mail failed:', err instanceof Error ? err.message : err);
  }
  return true;
}
