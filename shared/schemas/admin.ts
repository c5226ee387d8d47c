import { z } from 'zod';
import { Role } from './auth';

export const AdminUser = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: Role,
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type AdminUser = z.infer<typeof AdminUser>;

export const AdminUsersResponse = z.object({ users: z.array(AdminUser) });
export type AdminUsersResponse = z.infer<typeof AdminUsersResponse>;

export const AdminUserParams = z.object({ id: z.uuid({ error: 'That is not an account id' }) });

/** An admin's change to one account: a new role, or switching it off or on. */
export const UpdateAdminUserInput = z
  .object({ role: Role.optional(), disabled: z.boolean({ error: 'disabled is true or false' }).optional() })
  .refine((v) => v.role !== undefined || v.disabled !== undefined, { error: 'Send a role or disabled' });
export type UpdateAdminUserInput = z.infer<typeof UpdateAdminUserInput>;

export const AdminUserResponse = z.object({ user: AdminUser });
export type AdminUserResponse = z.infer<typeof AdminUserResponse>;

export const AuditEntry = z.object({
  id: z.number(),
  at: z.string(),
  action: z.string(),
  actor: z.object({ id: z.string(), name: z.string(), email: z.string() }).nullable(),
  target: z.object({ id: z.string(), name: z.string(), email: z.string() }).nullable(),
  detail: z.record(z.string(), z.union([z.string(), z.boolean()])),
});
export type AuditEntry = z.infer<typeof AuditEntry>;

export const AuditResponse = z.object({ entries: z.array(AuditEntry) });
export type AuditResponse = z.infer<typeof AuditResponse>;
