import type { WeekFigures } from '../../../shared/schemas/maps';

const DAY = 86_400_000;

/** The Mondays of the last `count` weeks (this week last), as dates in the time zone `tz`. */
export function recentWeeks(tz: string, count: number, now = new Date()): string[] {
  const today = new Intl.DateTimeFormat('en-CA', {
    timeZone: tz,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).format(now);
  const t = Date.parse(`${today}T00:00:00Z`);
  const monday = t - ((new Date(t).getUTCDay() + 6) % 7) * DAY;
  return Array.from({ length: count }, (_, i) =>
    new Date(monday - (count - 1 - i) * 7 * DAY).toISOString().slice(0, 10),
  );
}

/** One entry per week shown, empty weeks included, from rows keyed by their week. */
export function fillWeeks(
  weeks: string[],
  rows: { week: string; takes: number; accuracy: number; tempo: number }[],
): WeekFigures[] {
  const by = new Map(rows.map((r) => [r.week, r]));
  return weeks.map((week) => {
    const r = by.get(week);
    return r
      ? { week, takes: r.takes, accuracy: r.accuracy, tempo: r.tempo }
      : { week, takes: 0, accuracy: null, tempo: null };
  });
}
