import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AdminUsersResponse } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';

export const adminUsersKey = ['admin', 'users'] as const;

export function fetchAdminUsers(): Promise<AdminUsersResponse> {
  return api.get<AdminUsersResponse>('/api/admin/users');
}

export const adminUsersQueryOptions = queryOptions({ queryKey: adminUsersKey, queryFn: fetchAdminUsers });

export function useAdminUsers() {
  return useQuery(adminUsersQueryOptions);
}
