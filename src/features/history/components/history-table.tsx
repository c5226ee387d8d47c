import type { TakeSummary } from '@shared/schemas/history';
import { KEYS, TAKE_SORTS } from '@shared/schemas/history';
import type { ColumnDef, OnChangeFn, SortingState } from '@tanstack/react-table';
import { Link, useSearchParams } from 'react-router-dom';
import { type TakeListParams, useTakes } from '../api/takes';
import { DataTable } from '@/components/ui/data-table';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';

const columns: ColumnDef<TakeSummary>[] = [
  {
    id: 'startedAt',
    header: 'Date',
    accessorKey: 'startedAt',
    meta: { nowrap: true },
    cell: ({ row }) => (
      <Link to={`/history/${row.original.id}`} className="font-semibold underline-offset-2 hover:underline">
        {formatDateTime(row.original.startedAt)}
      </Link>
    ),
  },
  { id: 'pair', header: 'Pair', accessorKey: 'pair', enableSorting: false, meta: { nowrap: true } },
  { id: 'pattern', header: 'Pattern', accessorKey: 'pattern', enableSorting: false, meta: { nowrap: true } },
  { id: 'key', header: 'Key', accessorKey: 'key', meta: { nowrap: true } },
  { id: 'instrument', header: 'Instrument', accessorKey: 'instrument', enableSorting: false, meta: { nowrap: true } },
  { id: 'tempo', header: 'Tempo', accessorKey: 'tempo', meta: { numeric: true } },
  {
    id: 'accuracy',
    header: 'Accuracy',
    accessorKey: 'accuracy',
    cell: ({ row }) => `${Math.round(row.original.accuracy * 100)}%`,
    meta: { numeric: true },
  },
  {
    id: 'meanOffsetMs',
    header: 'Mean offset',
    enableSorting: false,
    cell: ({ row }) => (row.original.meanOffsetMs === null ? '—' : `${Math.round(row.original.meanOffsetMs)} ms`),
    meta: { numeric: true, nowrap: true },
  },
];

const FILTERS = ['key', 'pattern', 'pair', 'instrument', 'from', 'to'] as const;
/** The text filters match exactly, so each shows an example of what it takes. */
const FILTER_EXAMPLES = { pattern: 'four-three', pair: 'D/C', instrument: 'piano' } as const;
const FILTER_LABELS = { pattern: 'Pattern', pair: 'Pair', instrument: 'Instrument', from: 'From', to: 'To' } as const;

/** The player's takes, sorted, filtered and paged by the server; the address holds the state. */
export function HistoryTable() {
  const [params, setParams] = useSearchParams();
  const read = (k: string) => params.get(k) ?? undefined;
  const query: TakeListParams = {
    sort: (TAKE_SORTS as readonly string[]).includes(read('sort') ?? '')
      ? (read('sort') as TakeListParams['sort'])
      : 'startedAt',
    dir: read('dir') === 'asc' ? 'asc' : 'desc',
    page: Number(read('page') ?? 1) || 1,
    pageSize: 20,
    ...Object.fromEntries(FILTERS.map((f) => [f, read(f)])),
    player: read('player'),
  };
  const { data, isPending, error, isFetching } = useTakes(query);
  // A filter the server refused shows its message on that filter.
  const refused: Record<string, string[] | undefined> = error instanceof ApiError ? (error.fields ?? {}) : {};
  const set = (next: Record<string, string | undefined>) => {
    const p = new URLSearchParams(params);
    for (const [k, v] of Object.entries(next)) v ? p.set(k, v) : p.delete(k);
    setParams(p, { replace: true });
  };
  const sorting: SortingState = [{ id: query.sort ?? 'startedAt', desc: query.dir === 'desc' }];
  const onSortingChange: OnChangeFn<SortingState> = (up) => {
    const next = typeof up === 'function' ? up(sorting) : up;
    const s = next[0] ?? { id: 'startedAt', desc: true };
    set({ sort: s.id, dir: s.desc ? 'desc' : 'asc', page: undefined });
  };
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  return (
    <div className="grid gap-4">
      <form className="flex flex-wrap items-start gap-3" aria-label="Filter takes" onSubmit={(e) => e.preventDefault()}>
        <SelectField
          label="Key"
          value={read('key') ?? ''}
          onChange={(e) => set({ key: e.target.value, page: undefined })}
          options={[{ value: '', label: 'any' }, ...KEYS.map((k) => ({ value: k, label: k }))]}
          errors={refused.key}
        />
        {(['pattern', 'pair', 'instrument'] as const).map((f) => (
          <TextField
            key={f}
            label={FILTER_LABELS[f]}
            className="w-36"
            defaultValue={read(f) ?? ''}
            placeholder={FILTER_EXAMPLES[f]}
            onBlur={(e) => set({ [f]: e.target.value.trim(), page: undefined })}
            errors={refused[f]}
          />
        ))}
        {(['from', 'to'] as const).map((f) => (
          <TextField
            key={f}
            label={FILTER_LABELS[f]}
            type="date"
            value={read(f) ?? ''}
            onChange={(e) => set({ [f]: e.target.value, page: undefined })}
            errors={refused[f]}
          />
        ))}
      </form>
      {error ? <p role="alert">{error.message}</p> : null}
      <DataTable
        data={data?.takes ?? []}
        columns={columns}
        getRowId={(t) => t.id}
        caption={`Takes, ${data ? `${data.total} in all` : 'loading'}`}
        scrollLabel="Takes, scrolls sideways"
        testId="history-table"
        busy={isFetching}
        sorting={{ state: sorting, onChange: onSortingChange }}
        empty={isPending ? 'Loading takes…' : data && data.total === 0 ? 'No takes match.' : null}
      />
      <nav className="flex items-center gap-3" aria-label="Pages">
        <button
          type="button"
          disabled={(query.page ?? 1) <= 1}
          onClick={() => set({ page: String((query.page ?? 1) - 1) })}
          className="rounded-lg border border-line px-3 py-1 disabled:opacity-50"
        >
          Previous
        </button>
        <span>
          Page {query.page} of {pages} {data ? `(${data.total} takes)` : ''}
        </span>
        <button
          type="button"
          disabled={(query.page ?? 1) >= pages}
          onClick={() => set({ page: String((query.page ?? 1) + 1) })}
          className="rounded-lg border border-line px-3 py-1 disabled:opacity-50"
        >
          Next
        </button>
      </nav>
    </div>
  );
}
