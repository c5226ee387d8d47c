import type { ColumnDef } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { DataTable } from '@/components/ui/data-table';

/** A figure on its own ("12", "0.5", "40%"), which reads best right-aligned. */
const FIGURE = /^-?[\d.,]+\s?%?$/;

/**
 * The same numbers as a map, as a plain table (for screen readers and for reading exact values).
 * Columns holding only figures are right-aligned in tabular numbers.
 */
export function MapTable({ caption, head, rows }: { caption: string; head: string[]; rows: ReactNode[][] }) {
  const columns: ColumnDef<ReactNode[]>[] = head.map((h, j) => ({
    id: String(j),
    header: h,
    cell: ({ row }) => row.original[j],
    meta: {
      nowrap: true,
      numeric: rows.every((r) => typeof r[j] === 'number' || (typeof r[j] === 'string' && FIGURE.test(r[j]))),
    },
  }));
  return <DataTable data={rows} columns={columns} caption={caption} />;
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
