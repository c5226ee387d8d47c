import { Link } from 'react-router-dom';
import { SalesReport } from '@/features/books/components/sales-report';

/** /books/sales: the teacher's sales per book. */
export function BookSalesRoute() {
  return (
    <section className="grid gap-4">
      <p className="text-caption">
        <Link to="/books" className="font-semibold underline">
          ← My books
        </Link>
      </p>
      <h1 className="text-title">Drill book sales</h1>
      <SalesReport />
    </section>
  );
}
