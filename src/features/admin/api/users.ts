import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AdminUserResponse, AdminUsersResponse, UpdateAdminUserInput } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { adminKeys } from '@/lib/queries/keys';

export function fetchAdminUsers(): Promise<AdminUsersResponse> {
  return api.get<AdminUsersResponse>('/api/admin/users');
}

export const adminUsersQueryOptions = queryOptions({ queryKey: adminKeys.users, queryFn: fetchAdminUsers });

export function useAdminUsers() {
  return useQuery(adminUsersQueryOptions);
}

/** Change an account's role, or switch it off or on; the audit log gets a line for each. */
export function useUpdateAdminUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: UpdateAdminUserInput & { id: string }) =>
      api.patch<AdminUserResponse>(`/api/admin/users/${encodeURIComponent(id)}`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.all }),
  });
}
