import { formatPrice } from '@shared/schemas/books';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { useSales } from '../api/books';

const BAR_COLOURS = ['#22365b', '#d99a1e', '#2f9e5e', '#6b4fc2', '#d2492a'];

/** Sales per book (table) and books sold per day (chart, with its figures as a table too). */
export function SalesReport() {
  const { data, isPending, error } = useSales();
  if (isPending) return <p className="text-muted">Adding up your sales…</p>;
  if (error) return <p role="alert">{error.message}</p>;
  if (data.books.length === 0) return <p className="text-muted">No books yet.</p>;
  const titles = new Map(data.books.map((b) => [b.id, b.title]));
  const byDay = new Map<string, Record<string, number | string>>();
  for (const d of data.days) {
    const row = byDay.get(d.day) ?? { day: d.day };
    row[d.bookId] = d.sales;
    byDay.set(d.day, row);
  }
  const series = [...byDay.values()];
  const sold = data.books.filter((b) => data.days.some((d) => d.bookId === b.id));
  return (
    <div className="grid gap-6">
      <div className="overflow-x-auto rounded-card border border-line bg-raised">
        <table className="w-full text-left text-body" data-testid="sales-table">
          <caption className="sr-only">Sales per book</caption>
          <thead className="border-b border-line text-caption uppercase tracking-wider text-muted">
            <tr>
              <th scope="col" className="px-4 py-3">
                Book
              </th>
              <th scope="col" className="px-4 py-3">
                Price
              </th>
              <th scope="col" className="px-4 py-3 text-right">
                Sold
              </th>
              <th scope="col" className="px-4 py-3 text-right">
                Refunded
              </th>
              <th scope="col" className="px-4 py-3 text-right">
                Revenue
              </th>
            </tr>
          </thead>
          <tbody>
            {data.books.map((b) => (
              <tr key={b.id} className="border-b border-line last:border-0">
                <th scope="row" className="px-4 py-3 font-semibold">
                  {b.title}
                  {b.published ? null : <span className="ml-2 text-caption font-normal text-muted">(draft)</span>}
                </th>
                <td className="px-4 py-3">{formatPrice(b.priceMinor, b.currency)}</td>
                <td className="px-4 py-3 text-right tabular-nums">{b.sales}</td>
                <td className="px-4 py-3 text-right tabular-nums">{b.refunds}</td>
                <td className="px-4 py-3 text-right tabular-nums">{`${(b.revenueMinor / 100).toFixed(2)} ${b.currency}`}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <section className="grid gap-2" aria-label="Books sold per day">
        <h2 className="text-lead font-bold">Sold per day, last 90 days</h2>
        {series.length === 0 ? (
          <p className="text-muted">No sales yet.</p>
        ) : (
          <>
            <div className="h-64 w-full" aria-hidden="true">
              <ResponsiveContainer width="100%" height="100%">
                <BarChart data={series} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
                  <CartesianGrid strokeDasharray="3 3" opacity={0.4} />
                  <XAxis dataKey="day" tick={{ fontSize: 11 }} />
                  <YAxis allowDecimals={false} tick={{ fontSize: 11 }} />
                  <Tooltip />
                  <Legend />
                  {sold.map((b, i) => (
                    <Bar
                      key={b.id}
                      dataKey={b.id}
                      name={titles.get(b.id)}
                      stackId="sold"
                      fill={BAR_COLOURS[i % BAR_COLOURS.length]}
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
