import { PurchasesTable } from '@/features/books/components/purchases-table';

/** /admin/purchases: drill-book purchases and refunds. */
export function AdminPurchasesRoute() {
  return (
    <section className="grid gap-4">
      <h1 className="text-title">Purchases</h1>
      <p className="text-muted">
        A refund returns the payment and takes the book away from the player; it is written to the audit log.
      </p>
      <PurchasesTable />
    </section>
  );
}
