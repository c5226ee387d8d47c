import { type BookSales, formatPrice } from '@shared/schemas/books';
import type { ColumnDef } from '@tanstack/react-table';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { DataTable } from '@/components/ui/data-table';
import { useSales } from '../api/books';

/** Mid-tone colours that read on the light and the dark page alike. */
const BAR_COLOURS = ['#3b6fd8', '#d99a1e', '#2f9e5e', '#8a6fe0', '#e0603e'];
const DAYS_SHOWN = 90;
const DAY_MS = 86_400_000;

/** Every day of the last 90, oldest first (UTC dates, as the sales are counted). */
function lastDays(now = Date.now()): string[] {
  const today = Date.parse(`${new Date(now).toISOString().slice(0, 10)}T00:00:00Z`);
  return Array.from({ length: DAYS_SHOWN }, (_, i) =>
    new Date(today - (DAYS_SHOWN - 1 - i) * DAY_MS).toISOString().slice(0, 10),
  );
}

const columns: ColumnDef<BookSales>[] = [
  {
    id: 'book',
    header: 'Book',
    cell: ({ row: { original: b } }) => (
      <>
        {b.title}
        {b.published ? null : <span className="ml-2 text-caption font-normal text-muted">(draft)</span>}
      </>
    ),
    meta: { rowHeader: true },
  },
  {
    id: 'price',
    header: 'Price',
    cell: ({ row: { original: b } }) => formatPrice(b.priceMinor, b.currency),
    meta: { numeric: true, nowrap: true },
  },
  { id: 'sold', header: 'Sold', accessorKey: 'sales', meta: { numeric: true } },
  { id: 'refunded', header: 'Refunded', accessorKey: 'refunds', meta: { numeric: true } },
  {
    id: 'revenue',
    header: 'Revenue',
    cell: ({ row: { original: b } }) => `${(b.revenueMinor / 100).toFixed(2)} ${b.currency}`,
    meta: { numeric: true, nowrap: true },
  },
];

/** Sales per book (table) and books sold per day (chart, with its figures as a table too). */
export function SalesReport() {
  const { data, isPending, error } = useSales();
  if (isPending) return <p className="text-muted">Adding up your sales…</p>;
  if (error) return <p role="alert">{error.message}</p>;
  if (data.books.length === 0) return <p className="text-muted">No books yet.</p>;
  const titles = new Map(data.books.map((b) => [b.id, b.title]));
  const sold = data.books.filter((b) => data.days.some((d) => d.bookId === b.id));
  // One slot per day, days without sales at zero, so each bar is one day wide.
  const byDay = new Map<string, Record<string, number | string>>(
    lastDays().map((day) => [day, Object.fromEntries([['day', day], ...sold.map((b) => [b.id, 0])])]),
  );
  for (const d of data.days) {
    const row = byDay.get(d.day);
    if (row) row[d.bookId] = d.sales;
  }
  const series = data.days.length > 0 ? [...byDay.values()] : [];
  return (
    <div className="grid gap-6">
      <DataTable
        data={data.books}
        columns={columns}
        getRowId={(b) => b.id}
        caption="Sales per book"
        testId="sales-table"
      />
      <section className="grid gap-2" aria-label="Books sold per day">
        <h2 className="text-lead font-bold">Sold per day, last 90 days</h2>
        {series.length === 0 ? (
          <p className="text-muted">No sales yet.</p>
        ) : (
          <>
            <div className="h-64 w-full text-ink-700 dark:text-ink-100" aria-hidden="true" data-testid="sales-chart">
              <ResponsiveContainer width="100%" height="100%">
                <BarChart
                  data={series}
                  margin={{ top: 8, right: 16, bottom: 8, left: 0 }}
                  barCategoryGap={1}
                  accessibilityLayer={false}
                >
                  <CartesianGrid strokeDasharray="3 3" opacity={0.4} vertical={false} />
                  <XAxis dataKey="day" tick={{ fontSize: 11, fill: 'currentColor' }} minTickGap={24} />
                  <YAxis allowDecimals={false} tick={{ fontSize: 11, fill: 'currentColor' }} width={32} />
                  <Tooltip
                    cursor={{ fill: 'rgb(var(--sf-line))', opacity: 0.4 }}
                    contentStyle={{
                      background: 'rgb(var(--sf-raised))',
                      borderColor: 'rgb(var(--sf-line))',
                      color: 'rgb(var(--sf-text))',
                    }}
                  />
                  <Legend />
                  {sold.map((b, i) => (
                    <Bar
                      key={b.id}
                      dataKey={b.id}
                      name={titles.get(b.id)}
                      stackId="sold"
                      fill={BAR_COLOURS[i % BAR_COLOURS.length]}
                      maxBarSize={12}
                    />
                  ))}
                </BarChart>
              </ResponsiveContainer>
            </div>
            <details>
              <summary className="cursor-pointer text-caption text-muted">Figures as a table</summary>
              <ul className="text-caption">
                {data.days.map((d) => (
                  <li key={`${d.day}-${d.bookId}`}>
                    {d.day}: {titles.get(d.bookId)}, {d.sales} sold
                  </li>
                ))}
              </ul>
            </details>
          </>
        )}
      </section>
    </div>
  );
}
