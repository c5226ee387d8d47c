import { instruments, type InstrumentId } from '@shared/engine';
import { useState } from 'react';
import { type KeyMark, KeyboardDiagram, keyLabel } from '@/components/midi/keyboard-diagram';
import { type MapFilters, useRangeMap } from '../api/maps';
import { cellWords, HEAT_CSS, heatColour, heatStep, NO_DATA_CSS, pct } from './heat';
import { HeatLegend, NoDataPattern } from './heat-legend';
import { MapFrame, MapTable } from './map-table';

/** Error rate per pitch, drawn on a keyboard over the instrument's range. */
export function RangeMap({ filters }: { filters: MapFilters }) {
  const { data, error } = useRangeMap(filters);
  const [tableView, setTableView] = useState(false);
  const cells = data?.cells ?? [];
  const inst =
    filters.instrument && filters.instrument in instruments ? instruments[filters.instrument as InstrumentId] : null;
  const played = cells.map((c) => c.midi);
  const low = Math.min(inst?.range.low ?? 127, ...played);
  const high = Math.max(inst?.range.high ?? 0, ...played);
  const start = low - (low % 12);
  const marks = new Map<number, KeyMark>();
  // Every key drawn without notes is hatched, so no plain key is read as a score.
  for (let m = start; m <= high; m++) marks.set(m, { className: 'sf-nodata stroke-ink-300', label: 'no notes yet' });
  for (const c of cells)
    marks.set(c.midi, { className: `sf-heat-${heatStep(c.rate)}`, label: cellWords('', c).slice(2) });
  return (
    <MapFrame title="Range map" tableView={tableView} onToggle={() => setTableView((v) => !v)}>
      <style>{`${HEAT_CSS}\n${NO_DATA_CSS}`}</style>
      <NoDataPattern />
      {error ? <p role="alert">{error.message}</p> : null}
      {data && cells.length === 0 ? <p className="text-muted">No notes match these filters yet.</p> : null}
      {cells.length > 0 && tableView ? (
        <MapTable
          caption="Range map: error rate per pitch"
          head={['Pitch', 'MIDI', 'Notes', 'Not hit', 'Rate']}
          rows={cells.map((c) => [keyLabel(c.midi), c.midi, c.notes, c.errors, pct(c.rate)])}
        />
      ) : null}
      {cells.length > 0 && !tableView ? (
        <div className="grid gap-2" data-testid="range-map">
          <HeatLegend noData="hatched" />
          <KeyboardDiagram
            low={start}
            high={high}
            marks={marks}
            reach={inst?.range}
            label={`Range map from ${keyLabel(low)} to ${keyLabel(high)}`}
          />
          <ul className="flex flex-wrap gap-1" aria-label="Pitches played">
            {cells.map((c) => {
              const words = cellWords(keyLabel(c.midi), c);
              return (
                <li key={c.midi}>
                  <button
                    type="button"
                    title={words}
                    aria-label={words}
                    className="inline-block min-w-10 rounded px-1 py-0.5 text-center text-caption tabular-nums focus:outline-2"
                    style={heatColour(c.rate)}
                  >
                    {keyLabel(c.midi)}
                  </button>
                </li>
              );
            })}
          </ul>
        </div>
      ) : null}
    </MapFrame>
  );
}
