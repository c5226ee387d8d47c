import { type AdminPurchase, formatPrice } from '@shared/schemas/books';
import type { ColumnDef } from '@tanstack/react-table';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
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
  const columns: ColumnDef<AdminPurchase>[] = [
    {
      id: 'paid',
      header: 'Paid',
      cell: ({ row: { original: p } }) => (p.paidAt ? formatDateTime(p.paidAt) : '–'),
      meta: { nowrap: true, cellClassName: 'text-muted' },
    },
    { id: 'book', header: 'Book', cell: ({ row }) => row.original.book.title },
    {
      id: 'player',
      header: 'Player',
      cell: ({ row: { original: p } }) => `${p.player.name} <${p.player.email}>`,
    },
    {
      id: 'amount',
      header: 'Amount',
      cell: ({ row: { original: p } }) => formatPrice(p.amountMinor, p.currency),
      meta: { numeric: true, nowrap: true },
    },
    {
      id: 'state',
      header: 'State',
      cell: ({ row: { original: p } }) =>
        p.status === 'paid' ? (
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
        ),
    },
  ];
  return (
    <div className="grid gap-3">
      {refund.error ? <FormMessage tone="error">{refund.error.message}</FormMessage> : null}
      <DataTable data={shown} columns={columns} getRowId={(p) => p.id} caption="Purchases" empty="No purchases yet." />
    </div>
  );
}
