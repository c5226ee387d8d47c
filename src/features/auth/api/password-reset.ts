import { useMutation } from '@tanstack/react-query';
import type { OkResponse, PasswordResetConfirmInput, PasswordResetInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';

export function requestPasswordReset(input: PasswordResetInput): Promise<OkResponse> {
  return api.post<OkResponse>('/api/auth/password-reset', input);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}

export function confirmPasswordReset(input: PasswordResetConfirmInput): Promise<OkResponse> {
  return api.post<OkResponse>('/api/auth/password-reset/confirm', input);
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
