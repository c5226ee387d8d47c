import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { UserResponse } from '@shared/schemas/auth';
import type {
  AcceptInviteResponse,
  CreateInviteInput,
  InvitePreviewResponse,
  InviteResponse,
  InvitesResponse,
  InviteSignUpInput,
} from '@shared/schemas/studios';
import { api, resetCsrfToken } from '@/lib/api-client';
import { inviteKeys, studioKeys } from '@/lib/queries/keys';

export function useInvites(studioId: string) {
  return useQuery({
    queryKey: studioKeys.invites(studioId),
    queryFn: () => api.get<InvitesResponse>(`/api/studios/${encodeURIComponent(studioId)}/invites`),
  });
}

export function useCreateInvite(studioId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateInviteInput) =>
      api.post<InviteResponse>(`/api/studios/${encodeURIComponent(studioId)}/invites`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studioKeys.invites(studioId) }),
  });
}

/** What an invite link is for (no sign-in needed). */
export function useInvitePreview(token: string) {
  return useQuery({
    queryKey: inviteKeys.preview(token),
    queryFn: () => api.get<InvitePreviewResponse>(`/api/invites/${encodeURIComponent(token)}`),
    enabled: token.length > 0,
  });
}

export function useAcceptInvite(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<AcceptInviteResponse>(`/api/invites/${encodeURIComponent(token)}/accept`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studioKeys.all }),
  });
}

/**
 * Sign up through the invite. The session is a new one, so the page loads afresh on the studio
 * (every query and the CSRF token start over with it).
 */
export function useInviteSignUp(token: string, studioId: string) {
  return useMutation({
    mutationFn: (input: InviteSignUpInput) =>
      api.post<UserResponse>(`/api/invites/${encodeURIComponent(token)}/sign-up`, input),
    onSuccess: () => {
      resetCsrfToken();
      window.location.assign(`/studio/${encodeURIComponent(studioId)}`);
    },
  });
}
