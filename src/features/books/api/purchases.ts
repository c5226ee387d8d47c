import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AdminPurchaseResponse, AdminPurchasesResponse } from '@shared/schemas/books';
import { api } from '@/lib/api-client';

export const purchasesKey = ['admin', 'purchases'] as const;

export function usePurchases() {
  return useQuery({ queryKey: purchasesKey, queryFn: () => api.get<AdminPurchasesResponse>('/api/admin/purchases') });
}

/** An admin refunds a purchase: the player loses the book, the audit log records it. */
export function useRefundPurchase() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) =>
      api.post<AdminPurchaseResponse>(`/api/admin/purchases/${encodeURIComponent(id)}/refund`),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: purchasesKey }),
        queryClient.invalidateQueries({ queryKey: ['admin', 'audit'] }),
      ]),
  });
}
