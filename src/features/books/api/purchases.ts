import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AdminPurchaseResponse, AdminPurchasesResponse } from '@shared/schemas/books';
import { api } from '@/lib/api-client';
import { adminKeys } from '@/lib/queries/keys';

export function usePurchases() {
  return useQuery({
    queryKey: adminKeys.purchases,
    queryFn: () => api.get<AdminPurchasesResponse>('/api/admin/purchases'),
  });
}

/** An admin refunds a purchase: the player loses the book, the audit log records it. */
export function useRefundPurchase() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) =>
      api.post<AdminPurchaseResponse>(`/api/admin/purchases/${encodeURIComponent(id)}/refund`),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: adminKeys.purchases }),
        queryClient.invalidateQueries({ queryKey: adminKeys.audit }),
      ]),
  });
}
