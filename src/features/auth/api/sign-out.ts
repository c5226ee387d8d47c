import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OkResponse } from '@shared/schemas/auth';
import { api, resetCsrfToken } from '@/lib/api-client';
import { switchAccount } from './session';

export function signOut(): Promise<OkResponse> {
  return api.post<OkResponse>('/api/auth/sign-out');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  const forget = () => {
    resetCsrfToken();
    // Nothing of this account may linger for the next one on this browser.
    switchAccount(queryClient, null);
  };
  // A 401 means the session was already over: signed out either way.
  return useMutation({ mutationFn: signOut, onSuccess: forget, onError: forget });
}
