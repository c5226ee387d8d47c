import { useState } from 'react';
import { type MapFilters, useBeatMap } from '../api/maps';
import { cellWords, heatColour, pct } from './heat';
import { HeatLegend } from './heat-legend';
import { MapFrame, MapTable } from './map-table';

/** "1", "1+" (an eighth), "1⅓" ... : where in the bar, in the count players use. */
export function positionName(p: number): string {
  const beat = Math.floor(p + 1e-6);
  const frac = Math.round((p - beat) * 12);
  const names: Record<number, string> = { 0: '', 3: 'e', 4: '⅓', 6: '+', 8: '⅔', 9: 'a' };
  return `${beat}${names[frac] ?? `+${frac}/12`}`;
}

/** Error rate by position in the bar, one row per meter: trouble at the bar line shows at the ends. */
export function BeatMap({ filters }: { filters: MapFilters }) {
  const { data, error } = useBeatMap(filters);
  const [tableView, setTableView] = useState(false);
  const cells = data?.cells ?? [];
  const meters = [...new Set(cells.map((c) => c.meter))];
  return (
    <MapFrame title="Beat map" tableView={tableView} onToggle={() => setTableView((v) => !v)}>
      {error ? <p role="alert">{error.message}</p> : null}
      {data && cells.length === 0 ? <p className="text-muted">No notes match these filters yet.</p> : null}
      {cells.length > 0 && tableView ? (
        <MapTable
          caption="Beat map: error rate by position in the bar"
          head={['Meter', 'Position', 'Notes', 'Not hit', 'Rate']}
          rows={cells.map((c) => [c.meter, positionName(c.position), c.notes, c.errors, pct(c.rate)])}
        />
      ) : null}
      {cells.length > 0 && !tableView ? <HeatLegend /> : null}
      {cells.length > 0 && !tableView
        ? meters.map((m) => (
            <div key={m} className="grid gap-1" data-testid="beat-map">
              <p className="text-caption font-semibold text-muted">{m}</p>
              <ol className="flex flex-wrap gap-1" aria-label={`Positions in a bar of ${m}`}>
                {cells
                  .filter((c) => c.meter === m)
                  .map((c) => {
                    const words = cellWords(`${m}, ${positionName(c.position)}`, c);
                    return (
                      <li key={c.position}>
                        <button
                          type="button"
                          title={words}
                          className="flex h-14 w-12 flex-col items-center justify-center rounded text-caption tabular-nums focus:outline-2"
                          style={heatColour(c.rate)}
                        >
                          <span className="font-bold">{positionName(c.position)}</span>
                          <span>{pct(c.rate)}</span>
                          <span className="sr-only">{`not hit, in ${m} (${c.errors} of ${c.notes} notes)`}</span>
                        </button>
                      </li>
                    );
                  })}
              </ol>
            </div>
          ))
        : null}
    </MapFrame>
  );
}
