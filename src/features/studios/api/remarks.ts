import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { OkResponse } from '@shared/schemas/auth';
import type {
  CreateRemarkInput,
  NotificationsResponse,
  RemarkResponse,
  RemarksResponse,
} from '@shared/schemas/remarks';
import { api } from '@/lib/api-client';

const remarksKey = (takeId: string) => ['takes', takeId, 'remarks'] as const;

export function useRemarks(takeId: string) {
  return useQuery({
    queryKey: remarksKey(takeId),
    queryFn: () => api.get<RemarksResponse>(`/api/takes/${encodeURIComponent(takeId)}/remarks`),
  });
}

export function useCreateRemark(takeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateRemarkInput) =>
      api.post<RemarkResponse>(`/api/takes/${encodeURIComponent(takeId)}/remarks`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: remarksKey(takeId) }),
  });
}

export const notificationsKey = ['notifications'] as const;

export function useNotifications() {
  return useQuery({
    queryKey: notificationsKey,
    queryFn: () => api.get<NotificationsResponse>('/api/notifications'),
    refetchInterval: 60_000,
  });
}

export function useMarkNotificationsRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<OkResponse>('/api/notifications/read'),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notificationsKey }),
  });
}
