import { Link, useParams } from 'react-router-dom';
import { useBook } from '@/features/books/api/books';
import { AddDrillForm } from '@/features/books/components/add-drill-form';
import { BookDetailsForm } from '@/features/books/components/book-details-form';
import { BookDrillsEditor } from '@/features/books/components/book-drills-editor';

/** /books/:id/edit: the teacher's editor for one of their books. */
export function BookEditRoute() {
  const { id = '' } = useParams();
  const { data, isPending, error } = useBook(id);
  if (isPending) return <p className="text-muted">Loading the book…</p>;
  if (error) return <p role="alert">{error.message}</p>;
  const { book } = data;
  if (book.access !== 'owner') return <p role="alert">Only the book’s teacher can edit it.</p>;
  return (
    <div className="grid gap-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-title">Edit “{book.title}”</h1>
        <p className="flex gap-4 font-semibold">
          <Link to={`/books/${book.id}`} className="underline">
            Preview
          </Link>
          <Link to={`/books/${book.id}/print`} className="underline">
            Printable edition
          </Link>
        </p>
      </div>
      <BookDetailsForm key={book.id} book={book} />
      <section className="grid gap-3" aria-labelledby="drills-heading">
        <h2 id="drills-heading" className="text-lead font-bold">
          Drills
        </h2>
        <BookDrillsEditor book={book} />
        <AddDrillForm bookId={book.id} />
      </section>
    </div>
  );
}
