import type { AuditEntry } from '@shared/schemas/admin';
import { useAudit } from '../api/audit';
import { formatDateTime } from '@/lib/format-date';

function describe(e: AuditEntry): string {
  if (e.action === 'role.change') return `role ${e.detail.from} → ${e.detail.to}`;
  if (e.action === 'account.disable') return 'switched off';
  if (e.action === 'account.enable') return 'switched back on';
  return e.action;
}

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
  if (data.entries.length === 0) return <p className="text-muted">Nothing changed yet.</p>;
  return (
    <div className="overflow-x-auto rounded-card border border-line bg-raised">
      <table className="w-full text-left text-body">
        <caption className="sr-only">Audit log</caption>
        <thead className="border-b border-line text-caption uppercase tracking-wider text-muted">
          <tr>
            <th scope="col" className="px-4 py-3">
              When
            </th>
            <th scope="col" className="px-4 py-3">
              Admin
            </th>
            <th scope="col" className="px-4 py-3">
              Account
            </th>
            <th scope="col" className="px-4 py-3">
              Change
            </th>
          </tr>
        </thead>
        <tbody>
          {data.entries.map((e) => (
            <tr key={e.id} className="border-b border-line last:border-0">
              <td className="px-4 py-3 text-muted">{formatDateTime(e.at)}</td>
              <td className="px-4 py-3">{e.actor?.name ?? '(removed)'}</td>
              <td className="px-4 py-3">{e.target ? `${e.target.name} <${e.target.email}>` : '(removed)'}</td>
              <td className="px-4 py-3">{describe(e)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
