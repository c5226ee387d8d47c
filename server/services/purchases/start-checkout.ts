import type { User } from '../../../shared/schemas/auth';
import type { CheckoutResponse } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { purchases } from '../../db/schema';
import type { Env } from '../../env';
import { AppError } from '../../errors';
import { paymentsClient } from '../../payments/client';
import { loadVisibleBook } from '../books/access';

/**
 * Opens a hosted checkout for a priced book and returns its page's address. A pending purchase
 * row is kept under the session id; only the signed webhook ever marks it paid.
 */
export async function startCheckout(
  db: Db,
  env: Env,
  buyer: User,
  bookId: string,
  origin: string,
): Promise<CheckoutResponse> {
  const { book, access } = await loadVisibleBook(db, buyer, bookId);
  if (access === 'owner') throw new AppError('bad_request', 'This is your own book');
  if (access === 'free-book') throw new AppError('bad_request', 'This book is free: open any drill in it');
  if (access === 'bought') throw new AppError('conflict', 'You already have this book');
  const back = `${origin}/books/${book.id}`;
  let session: Awaited<ReturnType<ReturnType<typeof paymentsClient>['checkout']['sessions']['create']>>;
  try {
    session = await paymentsClient(env).checkout.sessions.create({
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: book.currency.toLowerCase(),
            unit_amount: book.priceMinor,
            product_data: { name: `${book.title} (Sixfold drill book)` },
          },
        },
      ],
      success_url: `${back}?checkout=done`,
      cancel_url: `${back}?checkout=cancelled`,
      client_reference_id: buyer.id,
      customer_email: buyer.email,
      metadata: { bookId: book.id, playerId: buyer.id },
    });
  } catch (err) {
    console.error('[payments] checkout session failed:', err instanceof Error ? err.message : err);
    throw new AppError('unavailable', 'The checkout could not be reached; try again in a minute');
  }
  if (!session.url) throw new AppError('unavailable', 'The checkout gave no page to go to; try again in a minute');
  await db.insert(purchases).values({
    bookId: book.id,
    playerId: buyer.id,
    sessionId: session.id,
    amountMinor: book.priceMinor,
    currency: book.currency,
  });
  return { url: session.url };
}
