import { useAdminUsers } from '../api/users';

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

/** Every account on this Sixfold, for the admin. */
export function UsersTable() {
  const { data, isPending, error } = useAdminUsers();
  if (isPending) return <p className="text-muted">Loading accounts…</p>;
  if (error) return <p role="alert" className="text-ember-700">{error.message}</p>;
  return (
    <div className="overflow-x-auto rounded-card border border-line bg-raised">
      <table className="w-full text-left text-body">
        <caption className="sr-only">Accounts</caption>
        <thead className="border-b border-line text-caption uppercase tracking-wider text-muted">
          <tr>
            <th scope="col" className="px-4 py-3">Name</th>
            <th scope="col" className="px-4 py-3">E-mail</th>
            <th scope="col" className="px-4 py-3">Role</th>
            <th scope="col" className="px-4 py-3">Status</th>
            <th scope="col" className="px-4 py-3">Joined</th>
          </tr>
        </thead>
        <tbody>
          {data.users.map((u) => (
            <tr key={u.id} className="border-b border-line last:border-0">
              <td className="px-4 py-3 font-semibold">{u.name}</td>
              <td className="px-4 py-3">{u.email}</td>
              <td className="px-4 py-3 capitalize">{u.role}</td>
              <td className="px-4 py-3">
                {u.disabled ? <span className="text-ember-700 dark:text-ember-100">Switched off</span> : <span className="text-reed-700 dark:text-reed-100">Active</span>}
              </td>
              <td className="px-4 py-3 text-muted">{dateFormat.format(new Date(u.createdAt))}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
