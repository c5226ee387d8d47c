import { KEYS } from '@shared/schemas/history';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { TableScroll } from '@/components/ui/table-scroll';
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
        <TableScroll label="Key map, scrolls sideways">
          <table className="border-separate border-spacing-1 text-caption" data-testid="key-map">
            <caption className="sr-only">Key map: error rate per key (columns) and pattern (rows)</caption>
            <thead>
              <tr>
                <th scope="col" className="sr-only">
                  Pattern
                </th>
                {KEYS.map((k) => (
                  <th key={k} scope="col" className="w-12 text-center font-bold">
                    {k}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {patterns.map((p) => (
                <tr key={p}>
                  <th scope="row" className="pr-2 text-right font-semibold">
                    {p}
                  </th>
                  {KEYS.map((k) => {
                    const c = at.get(`${k}|${p}`);
                    if (!c)
                      return (
                        <td
                          key={k}
                          className="h-10 w-12 rounded border border-dashed border-muted"
                          title={`${k}, ${p}: not played`}
                        />
                      );
                    const words = cellWords(`${k}, ${p}`, c);
                    return (
                      <td key={k} className="h-10 w-12 p-0">
                        <Link
                          to={link(k, p)}
                          title={words}
                          aria-label={`${words}. Open these takes`}
                          className="flex h-10 w-12 items-center justify-center rounded font-semibold tabular-nums focus:outline-2 focus:outline-offset-2"
                          style={heatColour(c.rate)}
                        >
                          {pct(c.rate)}
                        </Link>
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
      ) : null}
    </MapFrame>
  );
}
