import type { ColumnDef } from '@tanstack/react-table';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { DataTable, type DataTableProps } from '../../src/components/ui/data-table';

type Book = { id: string; title: string; sold: number; note: string | null };

const BOOKS: Book[] = [
  { id: 'b1', title: 'Starter pairs', sold: 12, note: null },
  { id: 'b2', title: 'Weaves in 7/8', sold: 3, note: 'draft' },
];

const columns: ColumnDef<Book>[] = [
  { id: 'title', header: 'Book', accessorKey: 'title', meta: { rowHeader: true } },
  { id: 'sold', header: 'Sold', accessorKey: 'sold', meta: { numeric: true } },
  {
    id: 'note',
    header: 'Note',
    enableSorting: false,
    cell: ({ row }) => row.original.note ?? '',
    meta: {
      hiddenHeader: true,
      cellClassName: (b) => (b.note ? 'italic' : 'not-italic'),
      cellProps: (b) => ({ title: b.note ?? 'no note' }),
    },
  },
];

const render = (props: Partial<DataTableProps<Book>> = {}) =>
  renderToStaticMarkup(
    createElement(DataTable<Book>, { data: BOOKS, columns, caption: 'Books', getRowId: (b) => b.id, ...props }),
  );

/** Every opening tag of one element, with its attributes, in document order. */
const tags = (html: string, name: string) => html.match(new RegExp(`<${name}(\\s[^>]*)?>`, 'g')) ?? [];

describe('the table component', () => {
  it('is a real table named by its caption, in a scroller named after it', () => {
    const html = render({ testId: 'books' });
    expect(html).toMatch(/<table[^>]*data-testid="books"/);
    expect(html).toContain('<caption class="sr-only">Books</caption>');
    expect(html).toMatch(/<section[^>]*aria-label="Books, scrolls sideways"/);
    expect(render({ scrollLabel: 'Sales, scrolls sideways' })).toMatch(/aria-label="Sales, scrolls sideways"/);
  });

  it('heads each column with a scoped heading and each row with its row heading', () => {
    const html = render();
    const heads = tags(html, 'th');
    expect(heads.filter((t) => t.includes('scope="col"'))).toHaveLength(3);
    expect(heads.filter((t) => t.includes('scope="row"'))).toHaveLength(2);
    expect(html).toMatch(/<th scope="row"[^>]*>Starter pairs<\/th>/);
    // the row heading is not a data cell, so a row's cells are the figures and the note
    expect(tags(html, 'td')).toHaveLength(4);
    // a hidden heading is still there for screen readers
    expect(html).toMatch(/<th scope="col"[^>]*><span class="sr-only">Note<\/span><\/th>/);
  });

  it('right-aligns figures in tabular numbers, heading and cells alike', () => {
    const html = render();
    expect(html).toMatch(/<th scope="col" class="[^"]*text-right[^"]*">Sold<\/th>/);
    expect(html).toMatch(/<td class="[^"]*text-right tabular-nums[^"]*">12<\/td>/);
    expect(html).not.toMatch(/<th scope="row" class="[^"]*text-right/);
  });

  it("gives a cell its column's classes and attributes for its row", () => {
    const html = render();
    expect(html).toMatch(/<td class="[^"]*not-italic[^"]*" title="no note"><\/td>/);
    expect(html).toMatch(/<td class="[^"]*\bitalic[^"]*" title="draft">draft<\/td>/);
  });

  it('passes data attributes to rows', () => {
    const html = render({ rowProps: (b) => ({ 'data-book': b.id, 'data-sold': b.sold }) });
    expect(html).toMatch(/<tr[^>]*data-book="b1" data-sold="12"/);
    expect(html).toMatch(/<tr[^>]*data-book="b2" data-sold="3"/);
  });

  it('says so when there are no rows, under the headings', () => {
    const html = render({ data: [], empty: 'No books yet.' });
    expect(tags(html, 'th')).toHaveLength(3);
    expect(html).toContain('<tbody></tbody>');
    expect(html).toContain('No books yet.');
    expect(render({ empty: 'No books yet.' })).not.toContain('No books yet.');
  });

  it('without a sorting state, no heading is a button or claims an order', () => {
    const html = render();
    expect(html).not.toContain('<button');
    expect(html).not.toContain('aria-sort');
  });

  it('sorted by its holder: sortable headings are buttons, the sorted one says its order, rows stay as given', () => {
    const html = render({ sorting: { state: [{ id: 'sold', desc: false }], onChange: () => {} } });
    const heads = tags(html, 'th').filter((t) => t.includes('scope="col"'));
    // "Book" can sort but is not sorted; "Sold" is sorted up; "Note" cannot sort
    expect(heads[0]).not.toContain('aria-sort');
    expect(heads[1]).toContain('aria-sort="ascending"');
    expect(heads[2]).not.toContain('aria-sort');
    expect(tags(html, 'button')).toHaveLength(2);
    expect(html).toMatch(/<button type="button"[^>]*>Book<span aria-hidden="true">↕<\/span><\/button>/);
    expect(html).toMatch(/<button type="button"[^>]*>Sold<span aria-hidden="true">▲<\/span><\/button>/);
    // manual sorting: the order is the server's (12 before 3 even though "up" is asked for)
    expect(html.indexOf('Starter pairs')).toBeLessThan(html.indexOf('Weaves in 7/8'));
    const down = render({ sorting: { state: [{ id: 'sold', desc: true }], onChange: () => {} } });
    expect(down).toContain('aria-sort="descending"');
    // an order the holder keeps by a column without a button is still said
    const byNote = render({ sorting: { state: [{ id: 'note', desc: true }], onChange: () => {} } });
    expect(byNote).toMatch(/<th scope="col" aria-sort="descending"[^>]*><span class="sr-only">Note<\/span><\/th>/);
  });

  it('a grid lays cells apart with no padding or rules of its own', () => {
    const html = render({ variant: 'grid' });
    expect(html).toMatch(/<table class="border-separate border-spacing-1/);
    expect(html).not.toContain('px-3');
    expect(html).not.toContain('border-b');
  });
});
