import type { Assignment } from '@shared/schemas/assignments';
import type { WeekFigures } from '@shared/schemas/maps';
import { TrendBars, trendDomain } from '@/components/charts/trend-bars';
import { useAssignmentWeekly } from '../api/assignments';
import { pct } from './status-badge';
import { formatDayMonth } from '@/lib/format-date';

const weekLabel = (w: string) => `week of ${formatDayMonth(new Date(`${w}T00:00:00Z`))}`;

/** What counts towards an assignment, in words: the rule the server applies. */
export function creditRule(a: Pick<Assignment, 'targetTempo' | 'targetAccuracy' | 'keys'>): string {
  return `Counts every whole take of this drill, on any instrument, in ${
    a.keys.length === 1 ? `${a.keys[0]}` : `each of its ${a.keys.length} keys`
  } at ${a.targetTempo} bpm or faster with ${pct(a.targetAccuracy)} or more, played after it was set, whichever button started it.`;
}

/** This week against the last week with takes, in words. */
function change(weeks: WeekFigures[]): string {
  const withTakes = weeks.filter((w) => w.accuracy !== null);
  const last = withTakes.at(-1);
  if (!last || last.accuracy === null) return 'No takes of this drill in six weeks.';
  const before = withTakes.at(-2);
  const now = `${weekLabel(last.week)}: ${pct(last.accuracy)}, fastest ${last.tempo} bpm`;
  if (!before || before.accuracy === null) return `${now}.`;
  const points = Math.round((last.accuracy - before.accuracy) * 100);
  const bpm = Math.round((last.tempo ?? 0) - (before.tempo ?? 0));
  return `${now} (${points === 0 ? 'accuracy level' : `${points > 0 ? 'up' : 'down'} ${Math.abs(points)} points`}, ${
    bpm === 0 ? 'same tempo' : `${bpm > 0 ? '+' : '−'}${Math.abs(bpm)} bpm`
  } on the ${weekLabel(before.week)}).`;
}

/**
 * Week over week for an assignment: accuracy and fastest tempo per week for each player (one
 * player when `playerId` is given), the bars scaled to the figures shown.
 */
export function AssignmentTrend({ assignmentId, playerId }: { assignmentId: string; playerId?: string }) {
  const { data, error } = useAssignmentWeekly(assignmentId);
  if (error) return <p className="text-caption text-muted">{error.message}</p>;
  if (!data) return null;
  const players = playerId ? data.players.filter((p) => p.playerId === playerId) : data.players;
  const all = players.flatMap((p) => p.weeks);
  const accDomain = trendDomain(
    all.map((w) => w.accuracy),
    { minSpan: 0.1, floor: 0, ceiling: 1 },
  );
  const tempoDomain = trendDomain(
    all.map((w) => w.tempo),
    { minSpan: 10, floor: 0 },
  );
  const labels = data.weeks.map(weekLabel);
  return (
    <ul className="grid gap-2" data-testid="assignment-trend">
      {players.map((p) => (
        <li key={p.playerId} className="grid gap-1">
          {players.length > 1 || !playerId ? <span className="text-caption font-semibold">{p.name}</span> : null}
          <div className="flex flex-wrap items-end gap-x-6 gap-y-2">
            <span className="grid gap-0.5">
              <span className="text-caption text-muted">Accuracy</span>
              <TrendBars
                values={p.weeks.map((w) => w.accuracy)}
                labels={labels}
                format={(v) => pct(v)}
                what={`${p.name}'s accuracy`}
                domain={accDomain}
                details={p.weeks.map((w) => `${w.takes} ${w.takes === 1 ? 'take' : 'takes'}`)}
              />
            </span>
            <span className="grid gap-0.5">
              <span className="text-caption text-muted">Fastest tempo</span>
              <TrendBars
                values={p.weeks.map((w) => w.tempo)}
                labels={labels}
                format={(v) => `${Math.round(v)} bpm`}
                what={`${p.name}'s fastest tempo`}
                domain={tempoDomain}
                tone="bg-ink-500 dark:bg-ink-300"
              />
            </span>
          </div>
          <span className="text-caption text-muted">{change(p.weeks)}</span>
        </li>
      ))}
    </ul>
  );
}
