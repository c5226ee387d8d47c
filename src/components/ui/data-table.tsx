import {
  type ColumnDef,
  flexRender,
  getCoreRowModel,
  type OnChangeFn,
  type RowData,
  type SortingState,
  useReactTable,
} from '@tanstack/react-table';
import type { HTMLAttributes, ReactNode, TdHTMLAttributes } from 'react';
import { TableScroll } from './table-scroll';

declare module '@tanstack/react-table' {
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Figures: right-aligned in tabular numbers, so digits line up down the column. */
    numeric?: boolean;
    /** The cell names its row (a row heading), e.g. the player or the book. */
    rowHeader?: boolean;
    /** The heading is read out but not shown (a column of buttons, a map's row names). */
    hiddenHeader?: boolean;
    /** The heading may wrap (long titles); otherwise headings stay on one line. */
    wrapHeader?: boolean;
    /** The cells stay on one line (dates, short codes). */
    nowrap?: boolean;
    headerClassName?: string;
    cellClassName?: string | ((row: TData) => string);
    /** Further attributes of a cell, e.g. a title on a map's empty cell. */
    cellProps?: (row: TData) => TdHTMLAttributes<HTMLTableCellElement>;
  }
}

/** Attributes of one row, `data-*` ones included (tests and scripts read rows by them). */
export type RowProps = HTMLAttributes<HTMLTableRowElement> & { [data: `data-${string}`]: string | number | undefined };

export type DataTableProps<T> = {
  data: T[];
  columns: ColumnDef<T>[];
  /** The table's name for screen readers (its caption). */
  caption: string;
  /** The scroller's name; by default the caption and that it scrolls sideways. */
  scrollLabel?: string;
  /** Shown under the headings when there are no rows (a loading line too, while there are none yet). */
  empty?: ReactNode;
  getRowId?: (row: T, index: number) => string;
  rowProps?: (row: T) => RowProps;
  /**
   * Sorted by whoever holds the state (the server, for the history): the headings of columns
   * that can sort become buttons and say how the table is sorted; the rows come as given.
   */
  sorting?: { state: SortingState; onChange: OnChangeFn<SortingState> };
  /**
   * "rows": the app's table (headings, rules between rows). "grid": cells spaced apart and styled
   * by their columns (the key map), with no padding or rules of its own.
   */
  variant?: 'rows' | 'grid';
  testId?: string;
  busy?: boolean;
  className?: string;
};

const cx = (...parts: (string | false | undefined)[]) => parts.filter(Boolean).join(' ');

function ariaSort(sorted: false | 'asc' | 'desc') {
  return sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined;
}

/**
 * Sixfold's table: a real table with a caption and scoped headings, figures right-aligned, a
 * message when it is empty, and a frame that scrolls sideways on a phone (and says so).
 */
export function DataTable<T>({
  data,
  columns,
  caption,
  scrollLabel,
  empty,
  getRowId,
  rowProps,
  sorting,
  variant = 'rows',
  testId,
  busy,
  className,
}: DataTableProps<T>) {
  const table = useReactTable({
    data,
    columns,
    getRowId,
    getCoreRowModel: getCoreRowModel(),
    enableSorting: sorting !== undefined,
    manualSorting: true,
    manualPagination: true,
    state: { sorting: sorting?.state ?? [] },
    onSortingChange: sorting?.onChange,
  });
  const rows = table.getRowModel().rows;
  const grid = variant === 'grid';
  return (
    <TableScroll label={scrollLabel ?? `${caption}, scrolls sideways`} className={className}>
      <table
        className={grid ? 'border-separate border-spacing-1 text-caption' : 'w-full text-left text-body'}
        data-testid={testId}
        aria-busy={busy || undefined}
      >
        <caption className="sr-only">{caption}</caption>
        <thead
          className={
            grid ? undefined : 'border-b border-line bg-surface/60 text-caption uppercase tracking-wider text-muted'
          }
        >
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((h) => {
                const meta = h.column.columnDef.meta;
                const sorted = h.column.getIsSorted();
                const label = flexRender(h.column.columnDef.header, h.getContext());
                return (
                  <th
                    key={h.id}
                    scope="col"
                    aria-sort={sorting ? ariaSort(sorted) : undefined}
                    className={cx(
                      !grid && 'px-3 py-2 align-bottom font-semibold',
                      !grid && !meta?.wrapHeader && 'whitespace-nowrap',
                      meta?.numeric && 'text-right',
                      meta?.headerClassName,
                    )}
                  >
                    {h.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={h.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 uppercase tracking-wider hover:text-text"
                      >
                        {label}
                        <span aria-hidden="true">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
                      </button>
                    ) : meta?.hiddenHeader ? (
                      <span className="sr-only">{label}</span>
                    ) : (
                      label
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr
              key={row.id}
              className={grid ? undefined : 'border-b border-line last:border-0'}
              {...rowProps?.(row.original)}
            >
              {row.getVisibleCells().map((cell) => {
                const meta = cell.column.columnDef.meta;
                const own =
                  typeof meta?.cellClassName === 'function' ? meta.cellClassName(row.original) : meta?.cellClassName;
                const classes = cx(
                  !grid && 'px-3 py-2',
                  meta?.nowrap && 'whitespace-nowrap',
                  meta?.numeric && 'text-right tabular-nums',
                  meta?.rowHeader && !grid && 'font-semibold',
                  own,
                );
                const content = flexRender(cell.column.columnDef.cell, cell.getContext());
                return meta?.rowHeader ? (
                  <th key={cell.id} scope="row" className={classes}>
                    {content}
                  </th>
                ) : (
                  <td key={cell.id} className={classes} {...meta?.cellProps?.(row.original)}>
                    {content}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      {rows.length === 0 && empty ? <p className="px-3 py-4 text-muted">{empty}</p> : null}
    </TableScroll>
  );
}
