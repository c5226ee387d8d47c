import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { OkResponse } from '@shared/schemas/auth';
import type {
  CreateRemarkInput,
  NotificationsResponse,
  RemarkResponse,
  RemarksResponse,
} from '@shared/schemas/remarks';
import { api } from '@/lib/api-client';
import { notificationKeys, remarkKeys } from '@/lib/queries/keys';

export function useRemarks(takeId: string) {
  return useQuery({
    queryKey: remarkKeys.forTake(takeId),
    queryFn: () => api.get<RemarksResponse>(`/api/takes/${encodeURIComponent(takeId)}/remarks`),
  });
}

export function useCreateRemark(takeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateRemarkInput) =>
      api.post<RemarkResponse>(`/api/takes/${encodeURIComponent(takeId)}/remarks`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: remarkKeys.forTake(takeId) }),
  });
}

export function useNotifications() {
  return useQuery({
    queryKey: notificationKeys.list,
    queryFn: () => api.get<NotificationsResponse>('/api/notifications'),
    refetchInterval: 60_000,
  });
}

export function useMarkNotificationsRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<OkResponse>('/api/notifications/read'),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notificationKeys.all }),
  });
}
