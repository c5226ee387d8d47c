import type { AuditEntry } from '@shared/schemas/admin';
import type { ColumnDef } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { useAudit } from '../api/audit';
import { formatDateTime } from '@/lib/format-date';

function describe(e: AuditEntry): string {
  if (e.action === 'role.change') return `role ${e.detail.from} → ${e.detail.to}`;
  if (e.action === 'account.disable') return 'switched off';
  if (e.action === 'account.enable') return 'switched back on';
  return e.action;
}

const columns: ColumnDef<AuditEntry>[] = [
  {
    id: 'at',
    header: 'When',
    cell: ({ row }) => formatDateTime(row.original.at),
    meta: { nowrap: true, cellClassName: 'text-muted' },
  },
  { id: 'admin', header: 'Admin', cell: ({ row }) => row.original.actor?.name ?? '(removed)' },
  {
    id: 'account',
    header: 'Account',
    cell: ({ row: { original: e } }) => (e.target ? `${e.target.name} <${e.target.email}>` : '(removed)'),
  },
  { id: 'change', header: 'Change', cell: ({ row }) => describe(row.original) },
];

/** The audit log for admins. */
export function AuditTable() {
  const { data, isPending, error } = useAudit();
  if (isPending) return <p className="text-muted">Loading the log…</p>;
  if (error)
    return (
      <p role="alert" className="text-ember-700">
        {error.message}
      </p>
    );
  return (
    <DataTable
      data={data.entries}
      columns={columns}
      getRowId={(e) => String(e.id)}
      caption="Audit log"
      empty="Nothing changed yet."
    />
  );
}
