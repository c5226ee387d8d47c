import type { ReactNode } from 'react';

/** The same numbers as a map, as a plain table (for screen readers and for reading exact values). */
export function MapTable({ caption, head, rows }: { caption: string; head: string[]; rows: ReactNode[][] }) {
  return (
    <div className="overflow-x-auto rounded-card border border-line bg-raised">
      <table className="w-full text-left text-body">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-line text-caption uppercase tracking-wider text-muted">
          <tr>
            {head.map((h) => (
              <th key={h} scope="col" className="px-3 py-2">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={i} className="border-b border-line last:border-0">
              {r.map((c, j) => (
                <td key={j} className="px-3 py-1.5 tabular-nums">
                  {c}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** A map with a "table view" switch; the switch is remembered only while the page is open. */
export function MapFrame({
  title,
  tableView,
  onToggle,
  children,
}: {
  title: string;
  tableView: boolean;
  onToggle: () => void;
  children: ReactNode;
}) {
  return (
    <section className="grid gap-3" aria-label={title}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lead font-bold">{title}</h2>
        <button
          type="button"
          aria-pressed={tableView}
          onClick={onToggle}
          className="rounded-lg border border-line px-3 py-1 text-caption font-semibold hover:border-ink-300"
        >
          {tableView ? 'Show as map' : 'Show as table'}
        </button>
      </div>
      {children}
    </section>
  );
}
