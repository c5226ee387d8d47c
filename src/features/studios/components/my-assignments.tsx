import { Link } from 'react-router-dom';
import { practiceLink, useMyAssignments } from '../api/assignments';
import { AssignmentTrend, creditRule } from './assignment-trend';
import { formatDue } from '@/lib/format-date';
import { pct, StatusBadge } from './status-badge';

/** A player's assignments, open and overdue first, each started in one click. */
export function MyAssignments() {
  const { data, isPending, error } = useMyAssignments();
  if (isPending) return <p className="text-muted">Looking up your assignments…</p>;
  if (error)
    return (
      <p role="alert" className="text-ember-700 dark:text-ember-100">
        {error.message}
      </p>
    );
  const order = { overdue: 0, open: 1, met: 2 } as const;
  const list = [...data.assignments].sort((a, b) => order[a.status ?? 'open'] - order[b.status ?? 'open']);
  if (list.length === 0) return <p className="text-muted">No assignments right now.</p>;
  return (
    <ul className="grid gap-3" data-testid="my-assignments">
      {list.map((a) => {
        const next = a.keys.find((k) => !a.keysMet.includes(k)) ?? a.keys[0];
        const href = practiceLink(a, next);
        return (
          <li key={a.id} className="flex flex-wrap items-center gap-3 rounded-card border border-line bg-raised p-4">
            <div className="min-w-0 flex-1">
              <p className="font-bold">
                {a.title} <StatusBadge status={a.status ?? 'open'} />
              </p>
              <p className="text-caption text-muted">
                {a.studioName} · due {formatDue(a.dueAt)} · {a.targetTempo} bpm at {pct(a.targetAccuracy)} ·{' '}
                {a.keysMet.length}/{a.keys.length} {a.keys.length === 1 ? 'key' : 'keys'}
              </p>
              {a.note ? <p className="mt-1 text-body">{a.note}</p> : null}
              <p className="mt-1 text-caption text-muted" data-testid="credit-rule">
                {creditRule(a)}
              </p>
              <details className="mt-2">
                <summary className="cursor-pointer text-caption font-semibold">Week over week</summary>
                <div className="mt-2">
                  <AssignmentTrend assignmentId={a.id} />
                </div>
              </details>
            </div>
            {href && a.status !== 'met' ? (
              <Link
                to={href}
                className="rounded-lg bg-ink-800 px-4 py-2 font-semibold text-white hover:bg-ink-700 dark:bg-brass-300 dark:text-ink-950"
              >
                Start {next}
              </Link>
            ) : null}
          </li>
        );
      })}
    </ul>
  );
}
