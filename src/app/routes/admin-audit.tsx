import { AuditTable } from '@/features/admin/components/audit-table';

export function AdminAuditRoute() {
  return (
    <section className="grid gap-4">
      <h1 className="text-title">Audit log</h1>
      <p className="text-muted">Every role change, and every account switched off or on, newest first.</p>
      <AuditTable />
    </section>
  );
}
