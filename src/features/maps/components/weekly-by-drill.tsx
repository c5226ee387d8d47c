import { TrendBars, trendDomain } from '@/components/charts/trend-bars';
import { type MapFilters, useWeekly } from '../api/maps';
import { formatDayMonth } from '@/lib/format-date';

const weekLabel = (w: string) => `week of ${formatDayMonth(new Date(`${w}T00:00:00Z`))}`;
const pct = (v: number) => `${Math.round(v * 100)}%`;

/**
 * Week over week for each drill practised in the last six weeks: mean accuracy and the fastest
 * tempo per week. Every row shares one scale per figure, from the figures shown.
 */
export function WeeklyByDrill({ filters }: { filters: MapFilters }) {
  const { data, error } = useWeekly(filters);
  if (error) return <p role="alert">{error.message}</p>;
  if (!data) return null;
  const weeks = data.drills.flatMap((d) => d.weeks);
  const accDomain = trendDomain(
    weeks.map((w) => w.accuracy),
    { minSpan: 0.1, floor: 0, ceiling: 1 },
  );
  const tempoDomain = trendDomain(
    weeks.map((w) => w.tempo),
    { minSpan: 10, floor: 0 },
  );
  const labels = data.weeks.map(weekLabel);
  return (
    <section className="grid gap-3" aria-labelledby="weekly-heading" data-testid="weekly-by-drill">
      <h2 id="weekly-heading" className="text-lead font-bold">
        Week over week, per drill
      </h2>
      <p className="text-caption text-muted">
        Six weeks, oldest first. Hover or focus a bar for its figure; each scale runs over the figures shown.
      </p>
      {data.drills.length === 0 ? <p className="text-muted">No takes in the last six weeks.</p> : null}
      <ul className="grid gap-3">
        {data.drills.map((d) => {
          const name = `${d.pattern} on ${d.pair}`;
          return (
            <li
              key={`${d.pattern}|${d.pair}|${d.instrument}`}
              className="grid items-end gap-x-6 gap-y-1 rounded-card border border-line bg-raised p-3 sm:grid-cols-[minmax(10rem,1fr)_auto_auto]"
            >
              <span className="font-semibold">
                {name} <span className="text-caption font-normal text-muted">{d.instrument}</span>
              </span>
              <span className="grid gap-0.5">
                <span className="text-caption text-muted">Accuracy</span>
                <TrendBars
                  values={d.weeks.map((w) => w.accuracy)}
                  labels={labels}
                  format={pct}
                  what={`${name}, accuracy`}
                  domain={accDomain}
                  details={d.weeks.map((w) => `${w.takes} ${w.takes === 1 ? 'take' : 'takes'}`)}
                />
              </span>
              <span className="grid gap-0.5">
                <span className="text-caption text-muted">Fastest tempo</span>
                <TrendBars
                  values={d.weeks.map((w) => w.tempo)}
                  labels={labels}
                  format={(v) => `${Math.round(v)} bpm`}
                  what={`${name}, fastest tempo`}
                  domain={tempoDomain}
                  tone="bg-ink-500 dark:bg-ink-300"
                />
              </span>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
