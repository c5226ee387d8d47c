import type { Role } from '@shared/schemas/auth';
import { useState } from 'react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TableScroll } from '@/components/ui/table-scroll';
import { useMe } from '@/features/auth/api/session';
import { useAdminUsers, useUpdateAdminUser } from '../api/users';
import { formatDate } from '@/lib/format-date';

const ROLES: Role[] = ['player', 'teacher', 'admin'];

/** Every account on this Sixfold, for the admin: change a role, switch an account off or on. */
export function UsersTable() {
  const { data, isPending, error } = useAdminUsers();
  const update = useUpdateAdminUser();
  const { user: me } = useMe();
  const [pending, setPending] = useState<{ id: string; name: string; from: Role; to: Role } | null>(null);
  if (isPending) return <p className="text-muted">Loading accounts…</p>;
  if (error)
    return (
      <p role="alert" className="text-ember-700 dark:text-ember-100">
        {error.message}
      </p>
    );
  return (
    <div className="grid gap-2">
      {update.error ? (
        <p role="alert" className="text-ember-700 dark:text-ember-100">
          {update.error.message}
        </p>
      ) : null}
      <ConfirmDialog
        open={pending !== null}
        title={pending ? `Make ${pending.name} ${pending.to === 'admin' ? 'an' : 'a'} ${pending.to}?` : ''}
        confirmLabel="Change the role"
        cancelLabel={pending ? `Keep ${pending.from}` : 'Cancel'}
        onCancel={() => setPending(null)}
        onConfirm={() => {
          if (pending) update.mutate({ id: pending.id, role: pending.to });
          setPending(null);
        }}
      >
        {pending
          ? `${pending.name} is ${pending.from === 'admin' ? 'an' : 'a'} ${pending.from} now. ${
              pending.to === 'admin'
                ? 'An admin can change every account on this Sixfold.'
                : pending.to === 'teacher'
                  ? 'A teacher can run studios and set assignments.'
                  : 'A player practises and keeps their own takes.'
            } The change is written to the audit log.`
          : null}
      </ConfirmDialog>
      <TableScroll label="Accounts, scrolls sideways">
        <table className="w-full text-left text-body">
          <caption className="sr-only">Accounts</caption>
          <thead className="border-b border-line text-caption uppercase tracking-wider text-muted">
            <tr>
              <th scope="col" className="px-4 py-3">
                Name
              </th>
              <th scope="col" className="px-4 py-3">
                E-mail
              </th>
              <th scope="col" className="px-4 py-3">
                Role
              </th>
              <th scope="col" className="px-4 py-3">
                Status
              </th>
              <th scope="col" className="px-4 py-3">
                Joined
              </th>
              <th scope="col" className="px-4 py-3">
                <span className="sr-only">Switch</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {data.users.map((u) => (
              <tr key={u.id} className="border-b border-line last:border-0">
                <td className="whitespace-nowrap px-4 py-3 font-semibold">{u.name}</td>
                <td className="px-4 py-3">{u.email}</td>
                <td className="px-4 py-3">
                  {u.id === me?.id ? (
                    <span className="capitalize">{u.role}</span>
                  ) : (
                    <select
                      aria-label={`Role of ${u.name}`}
                      value={pending?.id === u.id ? pending.to : u.role}
                      disabled={update.isPending}
                      onChange={(e) => setPending({ id: u.id, name: u.name, from: u.role, to: e.target.value as Role })}
                      className="rounded-lg border border-line bg-raised px-2 py-1 capitalize"
                    >
                      {ROLES.map((r) => (
                        <option key={r} value={r}>
                          {r}
                        </option>
                      ))}
                    </select>
                  )}
                </td>
                <td className="px-4 py-3">
                  {u.disabled ? (
                    <span className="text-ember-700 dark:text-ember-100">Switched off</span>
                  ) : (
                    <span className="text-reed-700 dark:text-reed-100">Active</span>
                  )}
                </td>
                <td className="px-4 py-3 text-muted">{formatDate(u.createdAt)}</td>
                <td className="px-4 py-3">
                  {u.id === me?.id ? null : (
                    <button
                      type="button"
                      className="whitespace-nowrap rounded-lg border border-line px-3 py-1 font-semibold hover:border-ink-300"
                      disabled={update.isPending}
                      onClick={() => update.mutate({ id: u.id, disabled: !u.disabled })}
                    >
                      {u.disabled ? `Switch ${u.name} on` : `Switch ${u.name} off`}
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroll>
    </div>
  );
}
