import { formatPrice } from '@shared/schemas/books';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { usePurchases, useRefundPurchase } from '../api/purchases';
import { formatDateTime } from '@/lib/format-date';

/** Drill-book purchases for admins, with a refund button on each paid one. */
export function PurchasesTable() {
  const { data, isPending, error } = usePurchases();
  const refund = useRefundPurchase();
  if (isPending) return <p className="text-muted">Loading purchases…</p>;
  if (error) return <p role="alert">{error.message}</p>;
  const shown = data.purchases.filter((p) => p.status !== 'pending');
  if (shown.length === 0) return <p className="text-muted">No purchases yet.</p>;
  return (
    <div className="grid gap-3">
      {refund.error ? <FormMessage tone="error">{refund.error.message}</FormMessage> : null}
      <div className="overflow-x-auto rounded-card border border-line bg-raised">
        <table className="w-full text-left text-body">
          <caption className="sr-only">Purchases</caption>
          <thead className="border-b border-line text-caption uppercase tracking-wider text-muted">
            <tr>
              <th scope="col" className="px-4 py-3">
                Paid
              </th>
              <th scope="col" className="px-4 py-3">
                Book
              </th>
              <th scope="col" className="px-4 py-3">
                Player
              </th>
              <th scope="col" className="px-4 py-3">
                Amount
              </th>
              <th scope="col" className="px-4 py-3">
                State
              </th>
            </tr>
          </thead>
          <tbody>
            {shown.map((p) => (
              <tr key={p.id} className="border-b border-line last:border-0">
                <td className="px-4 py-3 text-muted">{p.paidAt ? formatDateTime(p.paidAt) : '–'}</td>
                <td className="px-4 py-3">{p.book.title}</td>
                <td className="px-4 py-3">{`${p.player.name} <${p.player.email}>`}</td>
                <td className="px-4 py-3 tabular-nums">{formatPrice(p.amountMinor, p.currency)}</td>
                <td className="px-4 py-3">
                  {p.status === 'paid' ? (
                    <Button
                      variant="danger"
                      disabled={refund.isPending}
                      onClick={() => {
                        if (window.confirm(`Refund ${p.player.name} for “${p.book.title}”? They lose the book.`))
                          refund.mutate(p.id);
                      }}
                    >
                      Refund
                    </Button>
                  ) : (
                    <span className="font-semibold text-muted">refunded</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
