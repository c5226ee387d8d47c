import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { NumberField } from '@/components/ui/number-field';
import { type MapFilters, useCalendar, useSetWeeklyGoal } from '../api/maps';
import { formatDayMonth, formatLongDay } from '@/lib/format-date';

const WEEKS = 8;
const DAY_MS = 86_400_000;
const DAY_NAMES = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];
const dayOf = (t: number) => new Date(t).toISOString().slice(0, 10);
const mins = (m: number) => `${Math.round(m)} min`;
/** The height of the busiest day's bar. */
const BAR_PX = 40;

interface Week {
  start: number;
  days: { t: number; minutes: number; takes: number; future: boolean }[];
  total: number;
}

/** The last eight weeks, Monday first, newest at the top; days after today are left blank. */
function weeksOf(days: { day: string; minutes: number; takes: number }[], today: string): Week[] {
  const by = new Map(days.map((d) => [d.day, d]));
  const t0 = Date.parse(`${today}T00:00:00Z`);
  const monday = t0 - ((new Date(t0).getUTCDay() + 6) % 7) * DAY_MS;
  return Array.from({ length: WEEKS }, (_, w) => {
    const start = monday - w * 7 * DAY_MS;
    const week = Array.from({ length: 7 }, (_, d) => {
      const t = start + d * DAY_MS;
      const found = by.get(dayOf(t));
      return { t, minutes: found?.minutes ?? 0, takes: found?.takes ?? 0, future: t > t0 };
    });
    return { start, days: week, total: week.reduce((n, d) => n + d.minutes, 0) };
  });
}

/** An empty box clears the goal; anything else is read as a number (the schema judges it). */
const goalOf = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

function GoalForm({ goal }: { goal: number | null }) {
  const set = useSetWeeklyGoal();
  // The server's own settings schema, narrowed to the goal.
  const form = useSchemaForm(
    () => import('@shared/schemas/settings').then((m) => m.UpdateSettingsInput.pick({ weeklyMinutesGoal: true })),
    { defaultValues: { weeklyMinutesGoal: goal } },
  );
  const value = form.watch('weeklyMinutesGoal');
  const onSubmit = form.handleSubmit((input) =>
    set.mutate(input.weeklyMinutesGoal ?? null, { onError: form.fromError }),
  );
  return (
    <form onSubmit={onSubmit} className="flex flex-wrap items-start gap-2" aria-label="Weekly goal" noValidate>
      <NumberField
        label="Your weekly goal, in minutes"
        className="w-56"
        inputMode="numeric"
        min={10}
        max={2000}
        step={5}
        placeholder="e.g. 150"
        errors={form.errorsOf('weeklyMinutesGoal')}
        {...form.register('weeklyMinutesGoal', { setValueAs: goalOf })}
      />
      <Button type="submit" variant="quiet" className="mt-7" disabled={set.isPending}>
        {(value === null || Number.isNaN(value)) && goal !== null ? 'Clear the goal' : 'Set the goal'}
      </Button>
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      {set.isSuccess ? <span className="mt-9 text-caption text-muted">Saved.</span> : null}
    </form>
  );
}

/**
 * The practice log: one row per week, newest first. Each row has a bar per day, as tall as the
 * minutes played (scaled to the busiest day shown), and the week's total as a bar running
 * towards the player's own weekly goal, which they set here.
 */
export function PracticeLog({ filters, ownGoal }: { filters: MapFilters; ownGoal: boolean }) {
  const { data, error } = useCalendar(filters);
  if (error) return <p role="alert">{error.message}</p>;
  if (!data) return null;
  const goal = data.weeklyMinutesGoal;
  const weeks = weeksOf(data.days, data.today);
  const busiest = Math.max(1, ...weeks.flatMap((w) => w.days.map((d) => d.minutes)));
  const widest = Math.max(goal ?? 0, ...weeks.map((w) => w.total), 10);
  const thisWeek = weeks[0];
  return (
    <section className="grid gap-4" aria-labelledby="log-heading" data-testid="practice-log">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="log-heading" className="text-lead font-bold">
            Practice log
          </h2>
          <p className="text-muted" data-testid="log-summary">
            This week {mins(thisWeek.total)}
            {goal !== null
              ? thisWeek.total >= goal
                ? ` — the ${mins(goal)} goal is met.`
                : ` of a ${mins(goal)} goal: ${mins(goal - thisWeek.total)} to go.`
              : ownGoal
                ? '. Set a weekly goal to see each week against it.'
                : '. No weekly goal set.'}
          </p>
        </div>
        {ownGoal ? <GoalForm key={goal ?? 'none'} goal={goal} /> : null}
      </div>
      <ol className="grid gap-2" aria-label="Minutes per week, newest first">
        {weeks.map((w) => {
          const met = goal !== null && w.total >= goal;
          const label = `Week of ${formatDayMonth(w.start)}: ${mins(w.total)}${goal !== null ? ` of ${mins(goal)}` : ''}`;
          return (
            <li key={w.start} className="grid items-center gap-x-4 gap-y-1 sm:grid-cols-[7rem_auto_1fr]">
              <span className="text-caption font-semibold">Week of {formatDayMonth(w.start)}</span>
              <ul className="flex items-end gap-1" aria-label={`Days of the week of ${formatDayMonth(w.start)}`}>
                {w.days.map((d, i) => {
                  const words = d.future
                    ? `${formatLongDay(d.t)}: still to come`
                    : `${formatLongDay(d.t)}: ${d.minutes > 0 ? `${mins(d.minutes)}, ${d.takes} ${d.takes === 1 ? 'take' : 'takes'}` : 'no practice'}`;
                  // In pixels: a percentage height inside a button does not resolve everywhere.
                  const h = d.minutes > 0 ? Math.max(3, Math.round((d.minutes / busiest) * BAR_PX)) : 0;
                  return (
                    <li key={d.t} className="flex w-6 flex-col items-center gap-0.5">
                      <button
                        type="button"
                        title={words}
                        aria-label={words}
                        className="group relative flex w-full items-end justify-center rounded-sm focus-visible:outline-2"
                        style={{ height: BAR_PX }}
                      >
                        {d.future ? (
                          <span className="mb-0 h-px w-full border-t border-dashed border-line" />
                        ) : d.minutes > 0 ? (
                          <span className="w-4 rounded-t-sm bg-brass-500" style={{ height: h }} />
                        ) : (
                          <span className="h-1 w-4 rounded-sm bg-line" />
                        )}
                        <span
                          className="pointer-events-none absolute bottom-full z-10 mb-1 hidden whitespace-nowrap rounded border border-line bg-raised px-2 py-1 text-caption text-text shadow group-hover:block group-focus-visible:block"
                          aria-hidden="true"
                        >
                          {words}
                        </span>
                      </button>
                      <span className="text-[0.625rem] leading-none text-muted" aria-hidden="true">
                        {DAY_NAMES[i][0]}
                      </span>
                    </li>
                  );
                })}
              </ul>
              <div className="grid gap-0.5" title={label}>
                <div className="relative h-3 rounded-full bg-line/60" role="img" aria-label={label}>
                  <div
                    className={`h-3 rounded-full ${met ? 'bg-reed-500' : 'bg-ink-500 dark:bg-ink-300'}`}
                    style={{ width: `${Math.min(100, (w.total / widest) * 100)}%` }}
                  />
                  {goal !== null ? (
                    <div
                      className="absolute -top-1 h-5 w-0.5 bg-text"
                      style={{ left: `calc(${(goal / widest) * 100}% - 1px)` }}
                    />
                  ) : null}
                </div>
                <span className="text-caption tabular-nums text-muted">
                  {mins(w.total)}
                  {met ? ' · goal met' : ''}
                </span>
              </div>
            </li>
          );
        })}
      </ol>
      <ul className="flex flex-wrap gap-x-5 gap-y-1 text-caption text-muted" aria-label="Key to the practice log">
        <li>
          <span className="mr-1 inline-block h-3 w-2 rounded-t-sm bg-brass-500 align-middle" aria-hidden="true" />
          minutes that day (the tallest is {mins(busiest)})
        </li>
        <li>
          <span
            className="mr-1 inline-block h-2 w-5 rounded-full bg-ink-500 align-middle dark:bg-ink-300"
            aria-hidden="true"
          />
          the week's minutes
        </li>
        <li>
          <span className="mr-1 inline-block h-2 w-5 rounded-full bg-reed-500 align-middle" aria-hidden="true" />a week
          that met the goal
        </li>
        {goal !== null ? (
          <li>
            <span className="mr-1 inline-block h-3 w-0.5 bg-text align-middle" aria-hidden="true" />
            the goal, {mins(goal)}
          </li>
        ) : null}
        <li>Short blocks with rests spare your ears and hands more than one long sitting.</li>
      </ul>
    </section>
  );
}
