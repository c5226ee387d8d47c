import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChangePasswordInput, OkResponse, UpdateAccountInput, UserResponse } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { sessionKeys } from '@/lib/queries/keys';

export function updateAccount(input: UpdateAccountInput): Promise<UserResponse> {
  return api.patch<UserResponse>('/api/auth/me', input);
}

export function useUpdateAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateAccount,
    onSuccess: ({ user }) => queryClient.setQueryData(sessionKeys.session, { user }),
  });
}

export function changePassword(input: ChangePasswordInput): Promise<OkResponse> {
  return api.post<OkResponse>('/api/auth/password', input);
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
