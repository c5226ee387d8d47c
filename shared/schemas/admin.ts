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
