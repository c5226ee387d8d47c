import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useMe } from '@/features/auth/api/session';
import { useBook } from '@/features/books/api/books';
import { BookContents } from '@/features/books/components/book-contents';
import { BookCover } from '@/features/books/components/book-cover';
import { BuyPanel } from '@/features/books/components/buy-panel';

/** /books/:id: a book's page: cover, contents, the free drill to try, buying, practising. */
export function BookRoute() {
  const { id = '' } = useParams();
  const [params] = useSearchParams();
  const returned =
    params.get('checkout') === 'done' ? 'done' : params.get('checkout') === 'cancelled' ? 'cancelled' : null;
  const { user } = useMe();
  const first = useBook(id);
  // Back from checkout: ask again every second until the payment's webhook has granted the book.
  const waiting = returned === 'done' && first.data?.book.access === 'free-drill-only';
  const { data, isPending, error } = useBook(id, waiting ? 1000 : false);
  if (isPending) return <p className="text-muted">Loading the book…</p>;
  if (error) return <p role="alert">{error.message}</p>;
  const { book } = data;
  const full = book.access !== 'free-drill-only';
  return (
    <article className="grid gap-6">
      <div className="flex flex-wrap gap-6">
        <BookCover book={book} />
        <div className="grid min-w-0 flex-1 content-start gap-3">
          <p className="text-caption">
            <Link to="/books" className="font-semibold underline">
              ← All drill books
            </Link>
          </p>
          <h1 className="text-display">{book.title}</h1>
          <p className="text-muted">
            by {book.teacher.name} · {book.drills.length} drills{book.published ? '' : ' · draft'}
          </p>
          {book.description ? <p className="text-lead">{book.description}</p> : null}
          <BuyPanel book={book} signedIn={!!user} returned={returned} />
          <p className="flex flex-wrap gap-4 text-caption font-semibold">
            {full ? (
              <Link to={`/books/${book.id}/print`} className="underline">
                Printable edition (all drills, all 12 keys)
              </Link>
            ) : null}
            {book.access === 'owner' ? (
              <Link to={`/books/${book.id}/edit`} className="underline">
                Edit this book
              </Link>
            ) : null}
          </p>
        </div>
      </div>
      <BookContents book={book} canPractise={user?.role === 'player'} />
    </article>
  );
}
