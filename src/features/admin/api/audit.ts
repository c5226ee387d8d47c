import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditResponse } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';

export const auditKey = ['admin', 'audit'] as const;

export const auditQueryOptions = queryOptions({
  queryKey: auditKey,
  queryFn: () => api.get<AuditResponse>('/api/admin/audit'),
});

export function useAudit() {
  return useQuery(auditQueryOptions);
}
