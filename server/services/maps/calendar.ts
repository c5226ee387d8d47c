import { sql } from 'drizzle-orm';
import type { CalendarResponse, ChartQuery, PracticeDay } from '../../../shared/schemas/maps';
import type { Db } from '../../db/client';
import { getSettings } from '../settings/get';
import { takeWhere } from './take-where';

const dayNumber = (day: string) => Math.round(Date.parse(`${day}T00:00:00Z`) / 86_400_000);

/** Runs of consecutive days: the longest, and the one that reaches today (or yesterday, not yet broken). */
export function streaks(days: string[], today: string): CalendarResponse['streak'] {
  const nums = [...new Set(days.map(dayNumber))].sort((a, b) => a - b);
  let longest = 0;
  let run = 0;
  for (let i = 0; i < nums.length; i++) {
    run = i > 0 && nums[i] === nums[i - 1] + 1 ? run + 1 : 1;
    longest = Math.max(longest, run);
  }
  const last = nums.at(-1);
  const t = dayNumber(today);
  const current = last !== undefined && t - last <= 1 ? run : 0;
  return { current, longest };
}

/** Practice minutes and takes per day in the player's time zone, with streaks and their weekly goal. */
export async function practiceCalendar(
  db: Db,
  playerId: string,
  q: ChartQuery,
  now = new Date(),
): Promise<CalendarResponse> {
  const { rows } = await db.execute<PracticeDay>(sql`
    SELECT to_char((t.started_at AT TIME ZONE ${q.tz})::date, 'YYYY-MM-DD') AS day,
           round((sum(COALESCE(t.duration_ms, 0)) / 60000.0)::numeric, 1)::float8 AS minutes, count(*)::int AS takes
    FROM takes t WHERE ${takeWhere(playerId, q)}
    GROUP BY 1 ORDER BY 1`);
  const today = new Intl.DateTimeFormat('en-CA', {
    timeZone: q.tz,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).format(now);
  return {
    days: rows,
    streak: streaks(
      rows.map((r) => r.day),
      today,
    ),
    today,
    weeklyMinutesGoal: (await getSettings(db, playerId)).weeklyMinutesGoal ?? null,
  };
}
