import { Link } from 'react-router-dom';
import { UsersTable } from '@/features/admin/components/users-table';

export function AdminUsersRoute() {
  return (
    <section className="grid gap-4">
      <h1 className="text-title">Accounts</h1>
      <p className="text-muted">
        Everyone with an account on this Sixfold. Each role change and switch is written to the{' '}
        <Link to="/admin/audit" className="underline">
          audit log
        </Link>
        .
      </p>
      <UsersTable />
    </section>
  );
}
