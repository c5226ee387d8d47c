import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignUpInput, UserResponse } from '@shared/schemas/auth';
import { api, resetCsrfToken } from '@/lib/api-client';
import { switchAccount } from './session';

export function signUp(input: SignUpInput): Promise<UserResponse> {
  return api.post<UserResponse>('/api/auth/sign-up', input);
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: ({ user }) => {
      resetCsrfToken();
      switchAccount(queryClient, user);
    },
  });
}
