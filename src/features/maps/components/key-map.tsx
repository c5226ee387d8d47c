import { KEYS } from '@shared/schemas/history';
import type { ColumnDef } from '@tanstack/react-table';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { DataTable } from '@/components/ui/data-table';
import { type MapFilters, useKeyMap } from '../api/maps';
import { cellWords, heatColour, pct } from './heat';
import { HeatLegend } from './heat-legend';
import { MapFrame, MapTable } from './map-table';

/** Error rate per key x pattern; each cell opens its takes in the history. */
export function KeyMap({ filters, historyBase = '/history' }: { filters: MapFilters; historyBase?: string }) {
  const { data, isPending, error } = useKeyMap(filters);
  const [tableView, setTableView] = useState(false);
  const cells = data?.cells ?? [];
  const patterns = [...new Set(cells.map((c) => c.pattern))].sort();
  const at = new Map(cells.map((c) => [`${c.key}|${c.pattern}`, c]));
  const link = (key: string, pattern: string) =>
    `${historyBase}?${new URLSearchParams({ key, pattern, ...(filters.player ? { player: filters.player } : {}) })}`;
  const columns: ColumnDef<string>[] = [
    {
      id: 'pattern',
      header: 'Pattern',
      cell: ({ row }) => row.original,
      meta: { hiddenHeader: true, rowHeader: true, cellClassName: 'pr-2 text-right font-semibold' },
    },
    ...KEYS.map(
      (k): ColumnDef<string> => ({
        id: k,
        header: k,
        cell: ({ row: { original: p } }) => {
          const c = at.get(`${k}|${p}`);
          if (!c) return null;
          const words = cellWords(`${k}, ${p}`, c);
          return (
            <Link
              to={link(k, p)}
              title={words}
              aria-label={`${words}. Open these takes`}
              className="flex h-10 w-12 items-center justify-center rounded font-semibold tabular-nums focus:outline-2 focus:outline-offset-2"
              style={heatColour(c.rate)}
            >
              {pct(c.rate)}
            </Link>
          );
        },
        meta: {
          headerClassName: 'w-12 text-center font-bold',
          // a key not played in this pattern: an empty dashed cell, apart from every step of the scale
          cellClassName: (p) =>
            at.has(`${k}|${p}`) ? 'h-10 w-12 p-0' : 'h-10 w-12 rounded border border-dashed border-muted',
          cellProps: (p) => (at.has(`${k}|${p}`) ? {} : { title: `${k}, ${p}: not played` }),
        },
      }),
    ),
  ];
  return (
    <MapFrame title="Key map" tableView={tableView} onToggle={() => setTableView((v) => !v)}>
      {isPending ? <p className="text-muted">Counting…</p> : null}
      {error ? <p role="alert">{error.message}</p> : null}
      {data && cells.length === 0 ? <p className="text-muted">No takes match these filters yet.</p> : null}
      {cells.length > 0 && tableView ? (
        <MapTable
          caption="Key map: error rate per key and pattern"
          head={['Key', 'Pattern', 'Notes', 'Not hit', 'Rate']}
          rows={cells.map((c) => [c.key, c.pattern, c.notes, c.errors, pct(c.rate)])}
        />
      ) : null}
      {cells.length > 0 && !tableView ? <HeatLegend noData="dashed" /> : null}
      {cells.length > 0 && !tableView ? (
        <DataTable
          variant="grid"
          data={patterns}
          columns={columns}
          getRowId={(p) => p}
          caption="Key map: error rate per key (columns) and pattern (rows)"
          scrollLabel="Key map, scrolls sideways"
          testId="key-map"
        />
      ) : null}
    </MapFrame>
  );
}
