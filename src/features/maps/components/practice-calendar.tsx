import { interpolateCividis } from 'd3-scale-chromatic';
import { type MapFilters, useCalendar } from '../api/maps';

const WEEKS = 12;
const dayMs = 86_400_000;
const iso = (t: number) => new Date(t).toISOString().slice(0, 10);

/** Practice minutes per day (the player's own days) for the last twelve weeks, with streaks. */
export function PracticeCalendar({ filters }: { filters: MapFilters }) {
  const { data, error } = useCalendar(filters);
  if (error) return <p role="alert">{error.message}</p>;
  if (!data) return null;
  const minutes = new Map(data.days.map((d) => [d.day, d]));
  const today = Date.parse(`${data.today}T00:00:00Z`);
  const weekday = (new Date(today).getUTCDay() + 6) % 7; // Monday first
  const first = today - (WEEKS * 7 - 1 - (6 - weekday)) * dayMs;
  const most = Math.max(10, ...data.days.map((d) => d.minutes));
  const columns = Array.from({ length: WEEKS }, (_, w) =>
    Array.from({ length: 7 }, (_, d) => first + (w * 7 + d) * dayMs),
  );
  return (
    <section className="grid gap-3" aria-label="Practice calendar">
      <h2 className="text-lead font-bold">Practice minutes</h2>
      <p>
        Streak: <strong data-testid="streak-current">{data.streak.current}</strong>{' '}
        {data.streak.current === 1 ? 'day' : 'days'} · longest <strong>{data.streak.longest}</strong>
      </p>
      <figure className="m-0 flex gap-1" aria-label="Minutes per day, weeks as columns, Monday at the top">
        {columns.map((week) => (
          <div key={week[0]} className="grid gap-1">
            {week.map((t) => {
              const day = iso(t);
              const d = minutes.get(day);
              const future = t > today;
              const words = `${day}: ${d ? `${d.minutes} minutes, ${d.takes} takes` : 'no practice'}`;
              return (
                <button
                  type="button"
                  key={day}
                  disabled={future}
                  title={words}
                  aria-label={words}
                  className="block h-4 w-4 rounded-sm border border-line focus:outline-2"
                  style={{
                    background: future
                      ? 'transparent'
                      : d
                        ? interpolateCividis(Math.min(1, d.minutes / most))
                        : undefined,
                  }}
                />
              );
            })}
          </div>
        ))}
      </figure>
    </section>
  );
}
