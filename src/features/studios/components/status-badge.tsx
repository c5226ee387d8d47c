import type { AssignmentStatus } from '@shared/schemas/assignments';

const look: Record<AssignmentStatus, { text: string; cls: string }> = {
  met: { text: 'Met', cls: 'border-reed-500 bg-reed-100 text-reed-700' },
  open: { text: 'Open', cls: 'border-dusk-500 bg-dusk-100 text-dusk-700' },
  overdue: { text: 'Overdue', cls: 'border-ember-500 bg-ember-100 text-ember-700' },
};

/** An assignment's status in a word, told by text as well as colour. */
export function StatusBadge({ status }: { status: AssignmentStatus }) {
  const { text, cls } = look[status];
  return (
    <span className={`inline-block rounded-full border px-2 py-0.5 text-caption font-bold ${cls}`} data-status={status}>
      {text}
    </span>
  );
}

export const pct = (a: number | null | undefined) => (a === null || a === undefined ? '—' : `${Math.round(a * 100)}%`);
