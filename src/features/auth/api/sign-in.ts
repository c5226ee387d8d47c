import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignInInput, UserResponse } from '@shared/schemas/auth';
import { api, resetCsrfToken } from '@/lib/api-client';
import { switchAccount } from './session';

export function signIn(input: SignInInput): Promise<UserResponse> {
  return api.post<UserResponse>('/api/auth/sign-in', input);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => {
      // A new session comes with a new CSRF token.
      resetCsrfToken();
      switchAccount(queryClient, user);
    },
  });
}
