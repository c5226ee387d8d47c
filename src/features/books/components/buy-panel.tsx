import { type Book, formatPrice } from '@shared/schemas/books';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { useCheckout } from '../api/books';

/**
 * Price and the buy button. Buying goes to the hosted checkout page; back from it, the page
 * says so while it waits for the payment to come through (the server hears it by webhook).
 */
export function BuyPanel({
  book,
  signedIn,
  returned,
}: {
  book: Book;
  signedIn: boolean;
  returned: 'done' | 'cancelled' | null;
}) {
  const checkout = useCheckout(book.id);
  const price = formatPrice(book.priceMinor, book.currency);
  if (book.access === 'owner')
    return <FormMessage tone="info">This is your book. Players see it at {price}.</FormMessage>;
  if (book.access === 'free-book') return <FormMessage tone="success">Free: every drill is open to you.</FormMessage>;
  if (book.access === 'bought') {
    return (
      <FormMessage tone="success">
        {returned === 'done'
          ? 'Payment received. The whole book is yours: every drill is open.'
          : 'You have this book: every drill is open.'}
      </FormMessage>
    );
  }
  function buy() {
    // A refusal (no checkout without PUBLIC_URL, a book already bought) shows as checkout.error.
    checkout.mutate(undefined, { onSuccess: ({ url }) => window.location.assign(url) });
  }
  return (
    <div className="grid gap-3">
      {returned === 'done' ? (
        <FormMessage tone="info">
          <span aria-live="polite">Waiting for the payment to come through…</span>
        </FormMessage>
      ) : null}
      {returned === 'cancelled' ? (
        <FormMessage tone="info">Checkout cancelled; nothing was charged.</FormMessage>
      ) : null}
      {checkout.error ? <FormMessage tone="error">{checkout.error.message}</FormMessage> : null}
      <div className="flex flex-wrap items-center gap-4">
        <p className="text-title" data-testid="book-price">
          {price}
        </p>
        {signedIn ? (
          <Button onClick={buy} disabled={checkout.isPending || returned === 'done'}>
            {checkout.isPending ? 'Opening checkout…' : 'Buy the book'}
          </Button>
        ) : (
          <Link to={`/sign-in?next=${encodeURIComponent(`/books/${book.id}`)}`} className="font-semibold underline">
            Sign in to buy
          </Link>
        )}
      </div>
      <p className="text-caption text-muted">Payment happens on a secure checkout page; you come back here after it.</p>
    </div>
  );
}
