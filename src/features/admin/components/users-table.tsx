import type { AdminUser } from '@shared/schemas/admin';
import type { Role } from '@shared/schemas/auth';
import type { ColumnDef } from '@tanstack/react-table';
import { useState } from 'react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { DataTable } from '@/components/ui/data-table';
import { SelectField } from '@/components/ui/select-field';
import { useMe } from '@/features/auth/api/session';
import { useAdminUsers, useUpdateAdminUser } from '../api/users';
import { formatDate } from '@/lib/format-date';

const ROLE_OPTIONS = (['player', 'teacher', 'admin'] as const satisfies readonly Role[]).map((r) => ({
  value: r,
  label: r,
}));

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
  const columns: ColumnDef<AdminUser>[] = [
    { id: 'name', header: 'Name', accessorKey: 'name', meta: { rowHeader: true, nowrap: true } },
    { id: 'email', header: 'E-mail', accessorKey: 'email' },
    {
      id: 'role',
      header: 'Role',
      cell: ({ row: { original: u } }) =>
        u.id === me?.id ? (
          <span className="capitalize">{u.role}</span>
        ) : (
          <SelectField
            label={`Role of ${u.name}`}
            hideLabel
            className="capitalize"
            options={ROLE_OPTIONS}
            value={pending?.id === u.id ? pending.to : u.role}
            disabled={update.isPending}
            onChange={(e) => setPending({ id: u.id, name: u.name, from: u.role, to: e.target.value as Role })}
          />
        ),
    },
    {
      id: 'status',
      header: 'Status',
      cell: ({ row: { original: u } }) =>
        u.disabled ? (
          <span className="text-ember-700 dark:text-ember-100">Switched off</span>
        ) : (
          <span className="text-reed-700 dark:text-reed-100">Active</span>
        ),
    },
    {
      id: 'joined',
      header: 'Joined',
      cell: ({ row: { original: u } }) => formatDate(u.createdAt),
      meta: { nowrap: true, cellClassName: 'text-muted' },
    },
    {
      id: 'switch',
      header: 'Switch',
      meta: { hiddenHeader: true },
      cell: ({ row: { original: u } }) =>
        u.id === me?.id ? null : (
          <button
            type="button"
            className="whitespace-nowrap rounded-lg border border-line px-3 py-1 font-semibold hover:border-ink-300"
            disabled={update.isPending}
            onClick={() => update.mutate({ id: u.id, disabled: !u.disabled })}
          >
            {u.disabled ? `Switch ${u.name} on` : `Switch ${u.name} off`}
          </button>
        ),
    },
  ];
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
      <DataTable
        data={data.users}
        columns={columns}
        getRowId={(u) => u.id}
        caption="Accounts"
        empty="No accounts yet."
      />
    </div>
  );
}
