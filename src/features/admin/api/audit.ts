import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditResponse } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { adminKeys } from '@/lib/queries/keys';

export const auditQueryOptions = queryOptions({
  queryKey: adminKeys.audit,
  queryFn: () => api.get<AuditResponse>('/api/admin/audit'),
});

export function useAudit() {
  return useQuery(auditQueryOptions);
}
