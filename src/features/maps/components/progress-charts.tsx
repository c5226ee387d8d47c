import { KEYS } from '@shared/schemas/history';
import { useState } from 'react';
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { SelectField } from '@/components/ui/select-field';
import { type MapFilters, useTimeline } from '../api/maps';
import { MapTable } from './map-table';

/** Accuracy (mean) and tempo (highest) per practice day, for one key at a time. */
export function ProgressCharts({ filters }: { filters: MapFilters }) {
  const { data, error } = useTimeline(filters);
  const points = data?.points ?? [];
  const keys = KEYS.filter((k) => points.some((p) => p.key === k));
  const [chosen, setChosen] = useState<string>('');
  const key: string = chosen && (keys as string[]).includes(chosen) ? chosen : (keys[0] ?? '');
  const series = points
    .filter((p) => p.key === key)
    .map((p) => ({ day: p.day, accuracy: Math.round(p.accuracy * 100), tempo: p.tempo }));
  return (
    <section className="grid gap-3" aria-label="Accuracy and tempo over time">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="text-lead font-bold">Accuracy and tempo, key of</h2>
        <SelectField
          label="Key"
          hideLabel
          value={key}
          onChange={(e) => setChosen(e.target.value)}
          options={keys.map((k) => ({ value: k, label: k }))}
        />
      </div>
      {error ? <p role="alert">{error.message}</p> : null}
      {series.length > 0 ? (
        <>
          {/* The accuracy line and the axis figures take the wrapper's colour, so they read on both themes. */}
          <div className="h-64 w-full text-ink-700 dark:text-ink-100" aria-hidden="true">
            <ResponsiveContainer width="100%" height="100%">
              <LineChart data={series} margin={{ top: 8, right: 16, bottom: 8, left: 0 }} accessibilityLayer={false}>
                <CartesianGrid strokeDasharray="3 3" opacity={0.4} />
                <XAxis dataKey="day" tick={{ fontSize: 11, fill: 'currentColor' }} />
                <YAxis yAxisId="acc" domain={[0, 100]} unit="%" tick={{ fontSize: 11, fill: 'currentColor' }} />
                <YAxis yAxisId="tempo" orientation="right" tick={{ fontSize: 11, fill: 'currentColor' }} />
                <Tooltip
                  contentStyle={{
                    background: 'rgb(var(--sf-raised))',
                    borderColor: 'rgb(var(--sf-line))',
                    color: 'rgb(var(--sf-text))',
                  }}
                />
                <Legend />
                <Line
                  yAxisId="acc"
                  type="monotone"
                  dataKey="accuracy"
                  name="accuracy (%)"
                  stroke="currentColor"
                  strokeWidth={2}
                  dot={false}
                />
                <Line
                  yAxisId="tempo"
                  type="monotone"
                  dataKey="tempo"
                  name="tempo (bpm)"
                  stroke="#c9a227"
                  strokeWidth={2}
                  strokeDasharray="5 3"
                  dot={false}
                />
              </LineChart>
            </ResponsiveContainer>
          </div>
          <details>
            <summary className="cursor-pointer text-caption text-muted">Figures as a table</summary>
            <MapTable
              caption={`Accuracy and tempo per day, key of ${key}`}
              head={['Day', 'Accuracy', 'Tempo']}
              rows={series.map((s) => [s.day, `${s.accuracy}%`, s.tempo])}
            />
          </details>
        </>
      ) : (
        <p className="text-muted">No takes yet.</p>
      )}
    </section>
  );
}
